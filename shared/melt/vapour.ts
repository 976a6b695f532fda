import { tabulate, type TemperatureTable } from './temperature-table';

/**
 * Saturation vapour pressure and its tables for the hour loop.
 */

/**
 * Saturation vapour pressure over liquid water, Pa (Bolton 1980): 611.2 exp(17.67 T/(T + 243.5)).
 *
 * @param tempC air or surface temperature, °C
 * @example saturationOverWater(0) // 611.2
 */
export function saturationOverWater(tempC: number): number {
  return 611.2 * Math.exp((17.67 * tempC) / (tempC + 243.5));
}

/**
 * Saturation vapour pressure over ice, Pa (Buck 1981) [memory]: 611.15 exp(22.452 T/(272.55 + T)).
 * Used for snow and ice surfaces below 0 °C; at 0 °C it meets the curve over water within 0.1 Pa.
 *
 * @example saturationOverIce(-10) // ≈ 260
 */
export function saturationOverIce(tempC: number): number {
  return 611.15 * Math.exp((22.452 * tempC) / (272.55 + tempC));
}

/** Saturation vapour pressure over water for air temperatures −80 … 60 °C every 0.05 K, Pa. */
export function buildAirVapourTable(): TemperatureTable {
  return tabulate(saturationOverWater, -80, 60, 0.05);
}

/**
 * Saturation vapour pressure over ice at a frozen surface (−80 … 0 °C, every 0.05 K) and its
 * derivative, for the surface energy balance. Linear interpolation differs from the formula by
 * < 10⁻² Pa (tested).
 */
export interface SurfaceVapourTable {
  pressurePa: Float64Array;
  slopePaPerK: Float64Array;
}

export const SURFACE_TABLE_MIN_C = -80;
export const SURFACE_TABLE_STEP_C = 0.05;

let cached: SurfaceVapourTable | null = null;

export function surfaceVapourTable(): SurfaceVapourTable {
  if (cached) return cached;
  const pressure = tabulate(saturationOverIce, SURFACE_TABLE_MIN_C, 0, SURFACE_TABLE_STEP_C).values;
  const slope = tabulate((t) => (saturationOverIce(t + 0.001) - saturationOverIce(t - 0.001)) / 0.002, SURFACE_TABLE_MIN_C, 0, SURFACE_TABLE_STEP_C).values;
  cached = { pressurePa: pressure, slopePaPerK: slope };
  return cached;
}

/** Position of a surface temperature (°C, clamped to −80 … 0) in the surface table: index plus fraction. */
export function surfaceTablePosition(tempC: number): number {
  // Math.max rather than a ternary with the module constant, which V8 would box the float for (albedo-table.ts).
  const t = Math.max(tempC, SURFACE_TABLE_MIN_C);
  return ((t > 0 ? 0 : t) - SURFACE_TABLE_MIN_C) / SURFACE_TABLE_STEP_C;
}
