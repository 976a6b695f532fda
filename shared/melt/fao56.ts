/**
 * Daily extraterrestrial and clear-sky radiation after FAO Irrigation and Drainage Paper 56
 * (Allen et al. 1998), MJ m⁻² d⁻¹.
 */

/** Solar constant as FAO-56 states it, MJ m⁻² min⁻¹. */
const GSC_MJ_PER_MIN = 0.082;

function checkDay(latDeg: number, dayOfYear: number, fn: string): void {
  if (!(Math.abs(latDeg) <= 90)) throw new RangeError(`${fn}: latitude ${latDeg} is outside −90 … 90`);
  if (!Number.isInteger(dayOfYear) || dayOfYear < 1 || dayOfYear > 366) {
    throw new RangeError(`${fn}: dayOfYear ${dayOfYear} must be an integer 1 … 366`);
  }
}

/**
 * Extraterrestrial radiation on a horizontal surface, FAO-56 Eq. 21 with dr (Eq. 23),
 * declination (Eq. 24) and sunset hour angle (Eq. 25, clipped to 0 … π for polar night and day).
 *
 * @example extraterrestrialDaily(-20, 246) // ≈ 32.2 (FAO-56 Example 8)
 */
export function extraterrestrialDaily(latDeg: number, dayOfYear: number): number {
  checkDay(latDeg, dayOfYear, 'extraterrestrialDaily');
  const phi = (latDeg * Math.PI) / 180;
  const dr = 1 + 0.033 * Math.cos((2 * Math.PI * dayOfYear) / 365);
  const delta = 0.409 * Math.sin((2 * Math.PI * dayOfYear) / 365 - 1.39);
  const x = -Math.tan(phi) * Math.tan(delta);
  const omegaS = x >= 1 ? 0 : x <= -1 ? Math.PI : Math.acos(x);
  const ra = ((24 * 60) / Math.PI) * GSC_MJ_PER_MIN * dr *
    (omegaS * Math.sin(phi) * Math.sin(delta) + Math.cos(phi) * Math.cos(delta) * Math.sin(omegaS));
  return Math.max(0, ra);
}

/**
 * Clear-sky radiation, FAO-56 Eq. 37: Rso = (0.75 + 2·10⁻⁵ z) Ra.
 *
 * @param elevationM station elevation z, m
 * @example clearSkyDaily(-20, 246, 0) // ≈ 24.2
 */
export function clearSkyDaily(latDeg: number, dayOfYear: number, elevationM: number): number {
  if (!Number.isFinite(elevationM)) throw new RangeError('clearSkyDaily: elevation must be a finite number');
  return (0.75 + 2e-5 * elevationM) * extraterrestrialDaily(latDeg, dayOfYear);
}
