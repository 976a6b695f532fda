/**
 * Clear-sky shortwave after the ASCE-EWRI 2005 standardised reference evapotranspiration report,
 * Appendix D (Allen et al. 2005/2006) [read]:
 *   KB = 0.98 exp(−0.00146 P / (Kt sin β) − 0.075 (W / sin β)^0.4)       (Eq. D.2)
 *   KD = min(0.35 − 0.36 KB, 0.18 + 0.82 KB)                           (Eq. D.4)
 *   W  = 0.14 ea P + 2.1                                                (Eq. D.3, mm; ea, P in kPa)
 *   Rso = (KB + KD) Ra
 * with P the air pressure, Kt the turbidity coefficient (1 for clean air, 0.5 for extremely turbid,
 * dusty or polluted air), β the sun's elevation and Ra the extraterrestrial radiation on the
 * horizontal. KB + KD ≤ 0.98, so the clear sky never exceeds the extraterrestrial value.
 */

/** Precipitable water, mm (ASCE-EWRI 2005 Eq. D.3). */
export function precipitableWaterMm(vapourPressureKPa: number, pressureKPa: number): number {
  return 0.14 * vapourPressureKPa * pressureKPa + 2.1;
}

/** Lowest sin β used, as in ASCE-EWRI 2005 hourly practice, so KB stays defined near the horizon. */
export const MIN_SIN_ELEVATION = 0.01;

/**
 * Clearness index of the direct beam KB (Eq. D.2).
 *
 * @example beamIndex(87.82, Math.sin(65 * Math.PI / 180), 17.1, 1) // ≈ 0.67
 */
export function beamIndex(pressureKPa: number, sinElevation: number, precipitableMm: number, turbidity: number): number {
  const s = Math.max(sinElevation, MIN_SIN_ELEVATION);
  return beamIndexOf(pressureKPa, s, turbidity, Math.pow(precipitableMm / s, 0.4));
}

/** KB from its parts, with sin β already raised to MIN_SIN_ELEVATION and (W / sin β)^0.4 already worked out. */
export function beamIndexOf(pressureKPa: number, sinElevation: number, turbidity: number, waterPower: number): number {
  return 0.98 * Math.exp((-0.00146 * pressureKPa) / (turbidity * sinElevation) - 0.075 * waterPower);
}

/** Transmissivity index of diffuse radiation KD from KB (Eq. D.4). */
export function diffuseIndex(beam: number): number {
  const a = 0.35 - 0.36 * beam;
  const b = 0.18 + 0.82 * beam;
  return a < b ? a : b;
}

/**
 * Precipitable water falls off with height; the engine carries the station's value to each band
 * as W(z) = W(z0) exp(−(z − z0)/H) with a water-vapour scale height H of 2 km (common practice)
 * [memory], which lets the hour loop keep one exponential per band-hour.
 */
export const WATER_VAPOUR_SCALE_HEIGHT_M = 2000;

/** The band's factor (W(z)/W(z0))^0.4 in the beam exponent. */
export function precipitableWaterFactor(bandElevationM: number, stationElevationM: number): number {
  return Math.exp((-0.4 * (bandElevationM - stationElevationM)) / WATER_VAPOUR_SCALE_HEIGHT_M);
}
