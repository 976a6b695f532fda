import { DEG } from './constants';

/**
 * Cosine of the angle between the sun beam and the normal of a sloping surface:
 * cos θ = cos β cos Z + sin β sin Z cos(φsun − A) (Iqbal 1983; Duffie & Beckman 2013).
 * Negative values mean the slope faces away from the sun (self-shaded); callers clip at 0.
 *
 * @param zenithDeg solar zenith angle Z, degrees
 * @param sunAzimuthDeg solar azimuth φsun, degrees clockwise from north
 * @param slopeDeg slope β, degrees from horizontal (0 … 90)
 * @param aspectDeg aspect A, degrees clockwise from north (the direction the slope faces)
 * @example cosIncidence(50.111622, 194.340241, 30, 170) // ≈ cos 25.187°
 */
export function cosIncidence(zenithDeg: number, sunAzimuthDeg: number, slopeDeg: number, aspectDeg: number): number {
  for (const [name, value] of [['zenithDeg', zenithDeg], ['sunAzimuthDeg', sunAzimuthDeg], ['slopeDeg', slopeDeg], ['aspectDeg', aspectDeg]] as const) {
    if (!Number.isFinite(value)) throw new RangeError(`cosIncidence: ${name} must be a finite number`);
  }
  const z = zenithDeg * DEG;
  const b = slopeDeg * DEG;
  return Math.cos(b) * Math.cos(z) + Math.sin(b) * Math.sin(z) * Math.cos((sunAzimuthDeg - aspectDeg) * DEG);
}
