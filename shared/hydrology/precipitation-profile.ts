import type { ParameterSpec } from '../melt/parameters';
import { refuse, requireInRange } from './errors';
import { catchmentRange, type ElevationBand } from './stations';

/**
 * How precipitation changes with elevation, relative to the reference station.
 * - linear: P(z) = P(zref) · (1 + g (z − zref)/1000), the engine's own precipitation-gradient form;
 * - peaked: rises to a maximum at the peak elevation zp and decreases above it (piecewise linear):
 *     s(z) = max(0, 1 + gb (min(z, zp) − zref)/1000) · max(0, 1 − da max(z − zp, 0)/1000),
 *   gb the rise below the peak as a fraction of the reference amount per km (the linear form up to
 *   the peak), da the decrease above it as a fraction of the peak amount per km; the multiplier
 *   is s(z)/s(zref) (= s(z) for a reference station below the peak).
 *   High Mountain Asia profiles peak around 4000–5500 m and decrease above (Immerzeel et al. 2015,
 *   HESS 19:4673; Dahri et al. 2016, Sci. Total Environ. 548:289) [memory].
 */
export type PrecipitationProfile =
  | { kind: 'linear'; gradientPerKm: number }
  | { kind: 'peaked'; peakElevationM: number; gradientBelowPerKm: number; decreaseAbovePerKm: number };

/** Ranges of the profile parameters, with their sources, for forms and fits. */
export const PROFILE_PARAMETERS = {
  gradientPerKm: { default: 0.5, min: -0.5, max: 2, unit: 'fraction km⁻¹', source: 'relative increase per km above the reference station; Alpine catchment models use 2–10 % per 100 m [memory]; negative in rain shadows; assumption for the range' },
  peakElevationM: { default: 5000, min: 1000, max: 8000, unit: 'm', source: 'elevation of maximum precipitation; ≈ 4000–5500 m in the Upper Indus and Himalaya (Immerzeel et al. 2015, HESS 19:4673; Dahri et al. 2016) [memory]; must lie within the bands' },
  gradientBelowPerKm: { default: 0.5, min: 0, max: 3, unit: 'fraction km⁻¹', source: 'rise from the reference station to the peak, as a fraction of the reference amount per km; inferred High Asian profiles give 2–4 × more at altitude than at valley stations (Immerzeel et al. 2015) [memory]; range an assumption' },
  decreaseAbovePerKm: { default: 0.3, min: 0, max: 1.5, unit: 'fraction of peak km⁻¹', source: 'decrease above the peak, as a fraction of the peak amount per km (Immerzeel et al. 2015; Dahri et al. 2016) [memory]; range an assumption' },
} as const satisfies Record<string, ParameterSpec>;

/** Unnormalised shape of a peaked profile (1 at the reference elevation when it lies below the peak, ≥ 0). */
function peakedShape(zp: number, gb: number, da: number, zRef: number, z: number): number {
  const rise = 1 + (gb * (Math.min(z, zp) - zRef)) / 1000;
  const fall = 1 - (da * Math.max(z - zp, 0)) / 1000;
  return rise > 0 && fall > 0 ? rise * fall : 0;
}

/**
 * Precipitation at elevation z as a multiple of the precipitation at the reference elevation.
 * @param z elevation, m
 * @param referenceM elevation of the reference station, m
 * @example precipitationMultiplier({ kind: 'linear', gradientPerKm: 0.5 }, 3000, 2000) // 1.5
 * @example precipitationMultiplier({ kind: 'peaked', peakElevationM: 5000, gradientBelowPerKm: 0.5, decreaseAbovePerKm: 0.25 }, 6000, 3000) // 1.5
 */
export function precipitationMultiplier(profile: PrecipitationProfile, z: number, referenceM: number): number {
  if (profile.kind === 'linear') {
    const m = 1 + profile.gradientPerKm * ((z - referenceM) / 1000);
    return m > 0 ? m : 0;
  }
  const { peakElevationM: zp, gradientBelowPerKm: gb, decreaseAbovePerKm: da } = profile;
  const atReference = peakedShape(zp, gb, da, referenceM, referenceM);
  return atReference > 0 ? peakedShape(zp, gb, da, referenceM, z) / atReference : Number.NaN;
}

/**
 * Refuses a profile with a parameter outside its range, a peak outside the bands, or a shape that
 * gives no precipitation at the reference station (the multipliers would be undefined).
 * @param path where the profile sits in the caller's input, e.g. `profiles[6]`
 */
export function checkProfile(profile: PrecipitationProfile, bands: readonly ElevationBand[], referenceM: number, path: string): void {
  const spec = PROFILE_PARAMETERS;
  if (profile.kind === 'linear') {
    requireInRange(profile.gradientPerKm, spec.gradientPerKm.min, spec.gradientPerKm.max, `${path}.gradientPerKm`, 'The precipitation gradient', 'per km');
    return;
  }
  if (profile.kind !== 'peaked') refuse(`${path}.kind`, 'a precipitation profile is either linear or peaked.');
  const { bottomM, topM } = catchmentRange(bands);
  if (!Number.isFinite(profile.peakElevationM)) refuse(`${path}.peakElevationM`, 'the peak elevation must be a number.');
  if (profile.peakElevationM < bottomM || profile.peakElevationM > topM) {
    refuse(`${path}.peakElevationM`, `the precipitation peak at ${profile.peakElevationM} m lies outside the bands (${bottomM}–${topM} m).`);
  }
  requireInRange(profile.gradientBelowPerKm, spec.gradientBelowPerKm.min, spec.gradientBelowPerKm.max, `${path}.gradientBelowPerKm`, 'The gradient below the peak', 'per km');
  requireInRange(profile.decreaseAbovePerKm, spec.decreaseAbovePerKm.min, spec.decreaseAbovePerKm.max, `${path}.decreaseAbovePerKm`, 'The decrease above the peak', 'per km');
  if (!(precipitationMultiplier(profile, referenceM, referenceM) === 1)) {
    refuse(`${path}.decreaseAbovePerKm`, `with this decrease above the peak the profile gives no precipitation at the reference station (${referenceM} m).`);
  }
}
