import type { Forcing, Scenario } from './schema';
import type { Parameters } from './parameters';

/** Station forcing expanded to one value per simulated hour, with the scenario applied. */
export interface HourlyForcing {
  /** Air temperature at the station including the scenario change, °C. */
  temperatureC: Float64Array;
  /** Station air temperature without the scenario change, °C (for the daily temperature range). */
  stationTemperatureC: Float64Array;
  /** Precipitation at the station times the scenario factor, mm per hour. */
  precipitationMm: Float64Array;
  /** Relative humidity, 0.01 … 1. */
  relativeHumidity: Float64Array;
  windMs: Float64Array;
  /** Cloudiness 0 … 1 where the forcing has it (NaN elsewhere). */
  cloudiness: Float64Array | null;
  /** Measured global radiation on the horizontal, W m⁻² (hourly, or the daily mean in each hour). */
  globalRadiationWm2: Float64Array | null;
  /** Daily temperature range at the station, K, one value per simulated day. */
  dailyRangeK: Float64Array;
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
 * (common practice, e.g. Campbell 1985) [memory]. Daily precipitation, cloudiness, wind, humidity
 * and radiation are spread evenly over the day. Humidity below 0.01 is raised to 0.01 (Brutsaert
 * emissivity is 0 in perfectly dry air).
 */
export function expandForcing(forcing: Forcing, scenario: Scenario, params: Parameters, months: Uint8Array, firstDay: number, dayCount: number): HourlyForcing {
  const hours = dayCount * 24;
  const cloud = forcing.cloudiness && asNumbers(forcing.cloudiness);
  const radiation = forcing.globalRadiationWm2 && asNumbers(forcing.globalRadiationWm2);
  const out: HourlyForcing = {
    temperatureC: new Float64Array(hours),
    stationTemperatureC: new Float64Array(hours),
    precipitationMm: new Float64Array(hours),
    relativeHumidity: new Float64Array(hours),
    windMs: new Float64Array(hours),
    cloudiness: cloud ? new Float64Array(hours) : null,
    globalRadiationWm2: radiation ? new Float64Array(hours) : null,
    dailyRangeK: new Float64Array(dayCount),
  };
  const hourly = forcing.timeStep === 'hourly';
  const precipHourly = (forcing.precipitationStep ?? forcing.timeStep) === 'hourly';
  const precip = asNumbers(forcing.precipitationMm);
  const wind = forcing.windMs && asNumbers(forcing.windMs);
  const rh = forcing.relativeHumidity && asNumbers(forcing.relativeHumidity);
  const cycle = Float64Array.from({ length: 24 }, (_, k) => Math.cos((2 * Math.PI * (k + 0.5 - 15)) / 24));
  for (let d = 0; d < dayCount; d++) {
    const fd = firstDay + d;
    const month = months[d];
    const dT = monthValue(scenario.temperatureDeltaC, month);
    const pf = monthValue(scenario.precipitationFactor, month);
    let lowest = Infinity;
    let highest = -Infinity;
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
      if (t < lowest) lowest = t;
      if (t > highest) highest = t;
      out.stationTemperatureC[h] = t;
      out.temperatureC[h] = t + dT;
      out.precipitationMm[h] = pf * (precipHourly ? precip[fd * 24 + k] : precip[fd] / 24);
      out.windMs[h] = wind ? wind[src] : params.defaultWindMs;
      out.relativeHumidity[h] = rh ? Math.max(rh[src], 0.01) : params.defaultRelativeHumidity;
      if (cloud && out.cloudiness) out.cloudiness[h] = cloud[src];
      if (radiation && out.globalRadiationWm2) out.globalRadiationWm2[h] = radiation[src];
    }
    out.dailyRangeK[d] = forcing.timeStep === 'daily' ? (forcing.tMaxC[fd] as number) - (forcing.tMinC[fd] as number) : highest - lowest;
  }
  return out;
}
