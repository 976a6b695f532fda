import type { Forcing, Scenario } from './schema';
import type { Parameters } from './parameters';
import { cloudTransmission } from './shortwave';
import { OVERCAST_EMISSIVITY } from './longwave';
import { GAS_CONSTANT_DRY_AIR, SPECIFIC_HEAT_AIR } from './constants';

/** Station forcing expanded to one value per simulated hour, with the scenario applied. */
export interface HourlyForcing {
  /** Air temperature at the station including the scenario change, °C. */
  temperatureC: Float64Array;
  /** Precipitation at the station times the scenario factor, mm per hour. */
  precipitationMm: Float64Array;
  /** Cloud transmission of shortwave (Kasten & Czeplak 1980), 0.25 … 1. */
  cloudFactor: Float64Array;
  /** RH^(1/7) (1 − n⁴): multiplies the tabulated saturated clear-sky emissivity. */
  clearSkyEmissivityScale: Float64Array;
  /** 0.952 n⁴: the overcast share of the all-sky emissivity (Konzelmann et al. 1994). */
  overcastEmissivity: Float64Array;
  /** cp/Rd · CH · u, so the sensible coefficient of a band is P/T times this, W m⁻² K⁻¹ per (Pa/K). */
  sensibleScale: Float64Array;
}

/** Value of a constant-or-monthly scenario entry for month 0 … 11. */
export function monthValue(value: number | number[], month: number): number {
  return typeof value === 'number' ? value : value[month];
}

const asNumbers = (values: (number | null)[]): number[] => values as number[];

/**
 * Expands validated forcing to hours `firstDay·24 … (firstDay + dayCount)·24 − 1`.
 * Daily temperature follows a cosine through the day with its minimum at 03:00 and maximum at
 * 15:00 local time, mean (tMeanC, or the midpoint of min and max) and half-range amplitude
 * (common practice, e.g. Campbell 1985) [memory]. Daily precipitation, cloudiness, wind and
 * humidity are spread evenly over the day. Humidity below 0.01 is raised to 0.01 (Brutsaert
 * emissivity is 0 in perfectly dry air).
 */
export function expandForcing(forcing: Forcing, scenario: Scenario, params: Parameters, months: Uint8Array, firstDay: number, dayCount: number): HourlyForcing {
  const hours = dayCount * 24;
  const out: HourlyForcing = {
    temperatureC: new Float64Array(hours),
    precipitationMm: new Float64Array(hours),
    cloudFactor: new Float64Array(hours),
    clearSkyEmissivityScale: new Float64Array(hours),
    overcastEmissivity: new Float64Array(hours),
    sensibleScale: new Float64Array(hours),
  };
  const hourly = forcing.timeStep === 'hourly';
  const precipHourly = (forcing.precipitationStep ?? forcing.timeStep) === 'hourly';
  const precip = asNumbers(forcing.precipitationMm);
  const cloud = forcing.cloudiness && asNumbers(forcing.cloudiness);
  const wind = forcing.windMs && asNumbers(forcing.windMs);
  const rh = forcing.relativeHumidity && asNumbers(forcing.relativeHumidity);
  const cycle = Float64Array.from({ length: 24 }, (_, k) => Math.cos((2 * Math.PI * (k + 0.5 - 15)) / 24));
  for (let d = 0; d < dayCount; d++) {
    const fd = firstDay + d;
    const month = months[d];
    const dT = monthValue(scenario.temperatureDeltaC, month);
    const pf = monthValue(scenario.precipitationFactor, month);
    for (let k = 0; k < 24; k++) {
      const h = d * 24 + k;
      const src = hourly ? fd * 24 + k : fd;
      let t: number;
      if (forcing.timeStep === 'hourly') t = forcing.temperatureC[src] as number;
      else {
        const lo = forcing.tMinC[src] as number;
        const hi = forcing.tMaxC[src] as number;
        const mean = forcing.tMeanC ? (forcing.tMeanC[src] as number) : (lo + hi) / 2;
        t = mean + ((hi - lo) / 2) * cycle[k];
      }
      out.temperatureC[h] = t + dT;
      out.precipitationMm[h] = pf * (precipHourly ? precip[fd * 24 + k] : precip[fd] / 24);
      const n = cloud ? cloud[src] : params.defaultCloudiness;
      const u = wind ? wind[src] : params.defaultWindMs;
      const humidity = rh ? Math.max(rh[src], 0.01) : params.defaultRelativeHumidity;
      const n4 = n * n * n * n;
      out.cloudFactor[h] = cloudTransmission(n);
      out.clearSkyEmissivityScale[h] = Math.pow(humidity, 1 / 7) * (1 - n4);
      out.overcastEmissivity[h] = OVERCAST_EMISSIVITY * n4;
      out.sensibleScale[h] = (SPECIFIC_HEAT_AIR / GAS_CONSTANT_DRY_AIR) * params.exchangeCoefficient * u;
    }
  }
  return out;
}
