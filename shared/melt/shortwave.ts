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

