import { ICE_DENSITY_G_CM3 } from './constants';

/**
 * Broadband snow albedo after Gardner & Sharp 2010 (JGR 115, F01009) [read form, from the
 * authors' own implementation], with S = 3/(ρice r) in cm² g⁻¹ and c the black-carbon load in ppmw:
 *   clean:        αs  = 1.48 − S^−0.07
 *   impurities:   dαc = max(0.04 − αs, −c^0.55 / (0.16 + 0.6 S^0.5 + 1.8 c^0.6 S^−0.25))
 *   sun angle:    dαu = 0.53 αs (1 − (αs + dαc)) (1 − u)^1.2
 *   cloud:        dατ = 0.1 τ (αs + dαc)^1.3 / (1 + 1.5 τ)^αs
 * where u is the effective cosine of the zenith angle, u = 0.64 x + (1 − x) cos Z with
 * x = min(√(τ / (3 cos Z)), 1), and τ the cloud optical thickness. Dust enters as black-carbon
 * equivalent: c = (BC + dustToBlackCarbon · dust·1000)/1000 ppmw.
 */

export interface SnowAlbedoInput {
  /** Optical grain radius, µm (fresh ≈ 50–100, melting up to ≈ 1500). */
  grainRadiusUm: number;
  /** Black carbon in the surface snow, ng g⁻¹ (0 … 50 000). */
  blackCarbonNgG: number;
  /** Mineral dust in the surface snow, µg g⁻¹ (0 … 5 000). */
  dustUgG: number;
  /** cos of the solar zenith angle (0 … 1); omit for the diffuse-light value (no sun-angle term). */
  cosZenith?: number;
  /** Cloud optical thickness τ (0 for clear sky, the default). */
  cloudOpticalThickness?: number;
  /** Absorption of dust per unit mass relative to black carbon; default DEFAULT_DUST_TO_BLACK_CARBON. */
  dustToBlackCarbon?: number;
}

/** Dust absorbs ≈ 1/200 as much as black carbon per unit mass in the visible [memory]; user-set. */
export const DEFAULT_DUST_TO_BLACK_CARBON = 0.005;

/** Specific surface area S, cm² g⁻¹, of grains with radius r µm. */
export function specificSurfaceArea(grainRadiusUm: number): number {
  return 3 / (ICE_DENSITY_G_CM3 * grainRadiusUm * 1e-4);
}

/** Clean-snow albedo αs for grain radius r µm (Gardner & Sharp 2010). */
export function cleanSnowAlbedo(grainRadiusUm: number): number {
  return 1.48 - Math.pow(specificSurfaceArea(grainRadiusUm), -0.07);
}

/** Albedo change dαc (≤ 0) from a black-carbon-equivalent load in ng g⁻¹ (Gardner & Sharp 2010). */
export function impurityAlbedoChange(grainRadiusUm: number, blackCarbonEqNgG: number): number {
  if (blackCarbonEqNgG <= 0) return 0;
  const s = specificSurfaceArea(grainRadiusUm);
  const c = blackCarbonEqNgG / 1000;
  const drop = -Math.pow(c, 0.55) / (0.16 + 0.6 * Math.sqrt(s) + 1.8 * Math.pow(c, 0.6) * Math.pow(s, -0.25));
  return Math.max(0.04 - cleanSnowAlbedo(grainRadiusUm), drop);
}

/** Sun-angle factor (1 − u)^1.2 of dαu with the effective cosine u under cloud of optical thickness τ; 0 when the sun is down. */
export function sunAngleFactor(cosZenith: number, cloudOpticalThickness = 0): number {
  if (!(cosZenith > 0)) return 0;
  const cz = Math.min(cosZenith, 1);
  const x = Math.min(Math.sqrt(cloudOpticalThickness / (3 * cz)), 1);
  return Math.pow(1 - (0.64 * x + (1 - x) * cz), 1.2);
}

/** Cloud term dατ of Gardner & Sharp 2010 (0 for a clear sky). */
export function cloudAlbedoChange(clean: number, impurityChange: number, cloudOpticalThickness: number): number {
  if (!(cloudOpticalThickness > 0)) return 0;
  const loaded = clean + impurityChange;
  return (0.1 * cloudOpticalThickness * Math.pow(loaded, 1.3)) / Math.pow(1 + 1.5 * cloudOpticalThickness, clean);
}

/** Albedo from clean albedo, impurity change, the hour's sun-angle factor and the cloud term. */
export function combineSnowAlbedo(clean: number, impurityChange: number, sunFactor: number, cloudChange = 0): number {
  return clean + impurityChange + 0.53 * clean * (1 - (clean + impurityChange)) * sunFactor + cloudChange;
}

/**
 * Broadband albedo of snow with black carbon and dust (Gardner & Sharp 2010).
 *
 * @example snowAlbedo({ grainRadiusUm: 100, blackCarbonNgG: 0, dustUgG: 0 }) // ≈ 0.81
 */
export function snowAlbedo(input: SnowAlbedoInput): number {
  const { grainRadiusUm, blackCarbonNgG, dustUgG } = input;
  const ratio = input.dustToBlackCarbon ?? DEFAULT_DUST_TO_BLACK_CARBON;
  const tau = input.cloudOpticalThickness ?? 0;
  if (!(grainRadiusUm >= 10 && grainRadiusUm <= 5000)) throw new RangeError(`snowAlbedo: grain radius ${grainRadiusUm} µm is outside 10 … 5000`);
  if (!(blackCarbonNgG >= 0 && blackCarbonNgG <= 50000)) throw new RangeError(`snowAlbedo: black carbon ${blackCarbonNgG} ng/g is outside 0 … 50 000`);
  if (!(dustUgG >= 0 && dustUgG <= 5000)) throw new RangeError(`snowAlbedo: dust ${dustUgG} µg/g is outside 0 … 5 000`);
  if (!(ratio >= 0 && ratio <= 0.02)) throw new RangeError(`snowAlbedo: dust-to-black-carbon ratio ${ratio} is outside 0 … 0.02`);
  if (!(tau >= 0 && tau <= 100)) throw new RangeError(`snowAlbedo: cloud optical thickness ${tau} is outside 0 … 100`);
  const cosZ = input.cosZenith;
  if (cosZ !== undefined && !(cosZ >= -1 && cosZ <= 1)) throw new RangeError(`snowAlbedo: cosZenith ${cosZ} is outside −1 … 1`);
  const clean = cleanSnowAlbedo(grainRadiusUm);
  const change = impurityAlbedoChange(grainRadiusUm, blackCarbonNgG + dustUgG * 1000 * ratio);
  const sun = cosZ === undefined ? 0 : sunAngleFactor(cosZ, tau);
  return combineSnowAlbedo(clean, change, sun, cloudAlbedoChange(clean, change, tau));
}

/**
 * Thin snow lets the surface below show through, Oerlemans & Knap 1998 (J. Glaciol. 44:231)
 * [read]: α = αsnow + (αbelow − αsnow) exp(−d/d*), snow depth d, d* = 3.2 cm.
 *
 * @example thinSnowAlbedo(0.8, 0.34, 0.032, 0.032) // ≈ 0.63
 */
export function thinSnowAlbedo(snowAlbedoValue: number, belowAlbedo: number, snowDepthM: number, depthScaleM: number): number {
  return snowAlbedoValue + (belowAlbedo - snowAlbedoValue) * Math.exp(-snowDepthM / depthScaleM);
}
