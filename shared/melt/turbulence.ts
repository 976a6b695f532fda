import { GRAVITY, MEASUREMENT_HEIGHT_M, VON_KARMAN, ZERO_CELSIUS_K } from './constants';

/**
 * Bulk turbulent exchange over snow, ice and debris.
 *
 * Neutral exchange coefficient from roughness (logarithmic profile, roughness length for heat a
 * tenth of that for momentum; common practice, as in Essery's snow models):
 *   CH = k² / (ln(z/z0) ln(z/(0.1 z0))),  CD = (k / ln(z/z0))²
 * Stability after Louis et al. 1982 as quoted by Beljaars 1992 and used by Essery & Etchevers 2004
 * [read form], with the bulk Richardson number Ri = g (Ta − Ts) z / (Ta u²):
 *   stable   (Ri > 0): fh = 1 / (1 + 15 Ri √(1 + 5 Ri))
 *   unstable (Ri < 0): fh = 1 − 15 Ri / (1 + 75 CD √(−Ri z/z0))
 */

/** Neutral exchange coefficients for a roughness length z0 (m) at the measurement height. */
export function neutralExchange(roughnessM: number): { heat: number; drag: number; heightOverRoughness: number } {
  if (!(roughnessM > 0 && roughnessM < MEASUREMENT_HEIGHT_M)) throw new RangeError(`neutralExchange: roughness ${roughnessM} m must be between 0 and ${MEASUREMENT_HEIGHT_M} m`);
  const lnM = Math.log(MEASUREMENT_HEIGHT_M / roughnessM);
  const lnH = Math.log(MEASUREMENT_HEIGHT_M / (0.1 * roughnessM));
  return { heat: (VON_KARMAN * VON_KARMAN) / (lnM * lnH), drag: (VON_KARMAN / lnM) ** 2, heightOverRoughness: MEASUREMENT_HEIGHT_M / roughnessM };
}

/**
 * The roughness length that gives a stated neutral heat-exchange coefficient CH (inverse of
 * neutralExchange), so a run set by CH can still use the unstable branch, which needs z/z0.
 *
 * @example roughnessForExchange(0.002) // ≈ 7.7·10⁻⁴ m
 */
export function roughnessForExchange(exchangeCoefficient: number): number {
  const ln10 = Math.LN10;
  const x = (-ln10 + Math.sqrt(ln10 * ln10 + (4 * VON_KARMAN * VON_KARMAN) / exchangeCoefficient)) / 2;
  return MEASUREMENT_HEIGHT_M * Math.exp(-x);
}

/** Lowest wind speed used in the Richardson number, m s⁻¹: calmer air is treated as this (assumption). */
export const MIN_RICHARDSON_WIND_MS = 0.5;

/**
 * Stability factor fh multiplying the neutral exchange coefficient.
 *
 * @param airTempC air temperature at the measurement height, °C
 * @param surfaceTempC surface temperature, °C
 * @param windMs wind speed, m s⁻¹
 * @param drag neutral drag coefficient CD
 * @param heightOverRoughness z/z0
 * @example stabilityFactor(8, 0, 2, 0.0026, 2600) // ≈ 0.27 (warm air over melting ice is stable)
 */
export function stabilityFactor(airTempC: number, surfaceTempC: number, windMs: number, drag: number, heightOverRoughness: number): number {
  // Math.max rather than a ternary with the module constant, which V8 would box the float for (albedo-table.ts).
  const u = Math.max(windMs, MIN_RICHARDSON_WIND_MS);
  const ri = (GRAVITY * (airTempC - surfaceTempC) * MEASUREMENT_HEIGHT_M) / ((airTempC + ZERO_CELSIUS_K) * u * u);
  if (ri >= 0) return 1 / (1 + 15 * ri * Math.sqrt(1 + 5 * ri));
  return 1 - (15 * ri) / (1 + 75 * drag * Math.sqrt(-ri * heightOverRoughness));
}
