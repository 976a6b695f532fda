import { SOLAR_CONSTANT_WM2 } from './constants';

/**
 * Earth–Sun distance factor (Rm/R)² after Spencer 1971 [memory], dimensionless, 0.967 … 1.034.
 *
 * @param dayOfYear 1 … 366
 */
export function earthSunFactor(dayOfYear: number): number {
  const g = (2 * Math.PI * (dayOfYear - 1)) / 365;
  return 1.00011 + 0.034221 * Math.cos(g) + 0.00128 * Math.sin(g) + 0.000719 * Math.cos(2 * g) + 0.000077 * Math.sin(2 * g);
}

/** Top-of-atmosphere irradiance normal to the beam for a day, W m⁻². */
export function extraterrestrialNormal(dayOfYear: number): number {
  return SOLAR_CONSTANT_WM2 * earthSunFactor(dayOfYear);
}

/** Lowest cos Z used for the air mass, so the path length stays finite at the horizon. */
export const MIN_COS_ZENITH = 0.035;

/**
 * Clear-sky direct beam normal to the rays, W m⁻², Hock 1999 (J. Glaciol. 45:101):
 * I = I0 (Rm/R)² ψ^(P/(P0 cos Z)). The engine's hot loop uses the same expression in the form
 * exp(ln ψ / cos Z · P/P0) so that the logarithm is taken once per hour.
 *
 * @param normalTopWm2 I0 (Rm/R)², W m⁻²
 * @param transmissivity ψ, 0 … 1
 * @param pressureRatio P/P0
 * @param cosZenith cos Z (≤ 0: the sun is down and the beam is 0)
 */
export function clearSkyBeam(normalTopWm2: number, transmissivity: number, pressureRatio: number, cosZenith: number): number {
  if (cosZenith <= 0) return 0;
  return normalTopWm2 * Math.exp((Math.log(transmissivity) / Math.max(cosZenith, MIN_COS_ZENITH)) * pressureRatio);
}

/**
 * Cloud attenuation of global radiation, Kasten & Czeplak 1980 [memory]: G/Gclear = 1 − 0.75 n^3.4.
 *
 * @param cloudiness n, 0 … 1
 */
export function cloudTransmission(cloudiness: number): number {
  return 1 - 0.75 * Math.pow(cloudiness, 3.4);
}

export interface SlopeIrradianceInput {
  /** Beam normal to the rays, W m⁻². */
  beamNormalWm2: number;
  /** cos Z of the sun. */
  cosZenith: number;
  /** cos of the incidence angle on the slope (may be negative: self-shaded). */
  cosIncidence: number;
  /** Diffuse share of clear-sky global radiation on the horizontal (Erbs et al. 1982: 0.15–0.2) [memory]. */
  diffuseFraction: number;
  /** Sky-view factor (1 + cos β)/2. */
  skyView: number;
  /** Ground-view factor (1 − cos β)/2. */
  groundView: number;
  /** Albedo of the surrounding terrain that reflects onto the slope. */
  terrainAlbedo: number;
  /** Cloud transmission factor, 1 for clear sky. */
  cloudFactor: number;
}

/**
 * Global shortwave on a slope, W m⁻²: direct beam on the slope plus isotropic diffuse sky
 * (1 + cos β)/2 plus terrain reflection ρ G (1 − cos β)/2 (Duffie & Beckman 2013, isotropic sky),
 * scaled by cloud transmission. Diffuse horizontal D = B·f/(1 − f) so that D/(B + D) = f.
 */
export function slopeIrradiance(p: SlopeIrradianceInput): number {
  if (p.cosZenith <= 0) return 0;
  const beamHorizontal = p.beamNormalWm2 * p.cosZenith;
  const diffuseHorizontal = beamHorizontal * (p.diffuseFraction / (1 - p.diffuseFraction));
  const direct = p.cosIncidence > 0 ? p.beamNormalWm2 * p.cosIncidence : 0;
  const reflected = p.terrainAlbedo * (beamHorizontal + diffuseHorizontal) * p.groundView;
  return (direct + diffuseHorizontal * p.skyView + reflected) * p.cloudFactor;
}
