import { seededRandom } from '../../shared/analysis/random';
import type { StationFields } from '../../shared/schemas/stations';
import { DEMO_CATCHMENT } from './demo-catchment';
import { demoStation } from './demo-forcing';
import { DEMO_TRUTH } from './demo-truth';
import { normal } from './synthetic-station';

/**
 * Three more invented stations of the demo valley, run by invented networks at several elevations,
 * so the fitted lapse rates, the precipitation profile and the water-balance closure have
 * something to work on. Their series are made (never copied) from the reference station's record
 * with the demo's hidden truth (demo-truth.ts): the lapse rate of DEMO_TRUTH and the engine's
 * default precipitation gradient (+50 % per km above the reference station), so the fitted
 * gradients and the closure can be checked against what made the data. Every gauge shares the
 * reference gauge's undercatch, so all of them read about 1/1.45 of the precipitation that makes
 * the demo's runoff (what the closure has to find). On top: station noise (daily temperature
 * σ 0.4 °C, AR(1) φ 0.6; wet-day amounts lognormal σ 0.3), and shorter records up the valley.
 */
export interface DemoStation {
  fields: StationFields;
  /** First and last day of its record. */
  from: string;
  to: string;
  dailyTemperature: { times: string[]; values: number[] };
  dailyPrecipitation: { times: string[]; values: number[] };
  /** The accuracy each series states, as its station's fields state it. */
  accuracy: { temperature: string; precipitation: string };
  source: string;
  files: { temperature: string; precipitation: string };
}

const GRADIENT_PER_KM = 0.5;

/** The reference station's provenance (its name and elevation are the catchment's). */
export const DEMO_REFERENCE_STATION: StationFields = {
  name: DEMO_CATCHMENT.stationName, elevationM: DEMO_CATCHMENT.stationElevationM, network: 'Field team of the demo consultancy (invented)',
  instrument: 'Aspirated thermistor at 2 m; heated tipping-bucket gauge', latitudeDeg: 33.93, longitudeDeg: 79.29,
  accuracy: [{ variable: 'temperature', statement: '±0.3 °C (invented)' }, { variable: 'precipitation', statement: '±10 %, snow undercatch not corrected (invented)' }],
  licence: 'Own measurements for this study (invented)',
};

const STATIONS: (Omit<DemoStation, 'dailyTemperature' | 'dailyPrecipitation' | 'accuracy'> & { seed: number })[] = [
  {
    fields: {
      name: 'Dhenar village observatory', network: 'Dhenar Valley Irrigation Board (invented)', instrument: 'Screened thermometer read twice daily; standard rain gauge without wind shield',
      elevationM: 2950, latitudeDeg: 33.91, longitudeDeg: 79.26,
      accuracy: [{ variable: 'temperature', statement: '±0.5 °C (invented)' }, { variable: 'precipitation', statement: '±10 %, snow undercatch not corrected (invented)' }],
      licence: 'Invented: shared with the demo consultancy for this study only',
    },
    from: '2021-10-01', to: '2024-09-30', seed: 2950,
    source: 'Synthetic demo series (seed script, invented village observatory)',
    files: { temperature: 'dhenar-village-temperature-daily.csv', precipitation: 'dhenar-village-precipitation-daily.csv' },
  },
  {
    fields: {
      name: 'Sarvel moraine mast', network: 'Glacier research group of an invented university', instrument: 'Ventilated thermistor; weighing gauge with Alter shield',
      elevationM: 4380, latitudeDeg: 33.96, longitudeDeg: 79.33,
      accuracy: [{ variable: 'temperature', statement: '±0.2 °C (invented)' }, { variable: 'precipitation', statement: '±8 % (invented)' }],
      licence: 'Invented open research licence, cite the invented group',
    },
    from: '2022-06-01', to: '2024-09-30', seed: 4380,
    source: 'Synthetic demo series (seed script, invented moraine mast)',
    files: { temperature: 'sarvel-moraine-temperature-daily.csv', precipitation: 'sarvel-moraine-precipitation-daily.csv' },
  },
  {
    fields: {
      name: 'Tsaro col station', network: 'High-altitude monitoring programme (invented)', instrument: 'Thermistor in a passive screen; snow pillow and heated tipping bucket',
      elevationM: 5150, latitudeDeg: 33.98, longitudeDeg: 79.36,
      accuracy: [{ variable: 'temperature', statement: '±0.3 °C (invented)' }, { variable: 'precipitation', statement: '±15 % (invented)' }],
      licence: 'Invented programme data, non-commercial use',
    },
    from: '2022-10-01', to: '2024-09-30', seed: 5150,
    source: 'Synthetic demo series (seed script, invented col station)',
    files: { temperature: 'tsaro-col-temperature-daily.csv', precipitation: 'tsaro-col-precipitation-daily.csv' },
  },
];

/** A station's stated accuracy of its two series, from its fields (stated once, there). */
export function statedAccuracy(fields: StationFields): DemoStation['accuracy'] {
  const of = (variable: 'temperature' | 'precipitation') => {
    const stated = fields.accuracy?.find((a) => a.variable === variable)?.statement;
    if (!stated) throw new Error(`Demo station ${fields.name} states no ${variable} accuracy.`);
    return stated;
  };
  return { temperature: of('temperature'), precipitation: of('precipitation') };
}

let cached: DemoStation[] | null = null;

/** The demo's other stations with their daily records, made once per process. */
export function demoStations(): DemoStation[] {
  if (cached) return cached;
  const reference = demoStation();
  const zRef = DEMO_CATCHMENT.stationElevationM;
  // Daily means of the reference station's hourly temperature (the logger gap's day from the hours it has).
  const sums = new Map<string, { sum: number; n: number }>();
  reference.hourlyTemperature.times.forEach((t, i) => {
    const day = t.slice(0, 10);
    const s = sums.get(day) ?? { sum: 0, n: 0 };
    s.sum += reference.hourlyTemperature.values[i];
    s.n += 1;
    sums.set(day, s);
  });
  const lapse = (DEMO_TRUTH.parameters.lapseRateCPerKm ?? -6.5) / 1000;
  cached = STATIONS.map(({ seed, ...s }) => {
    const random = seededRandom(seed);
    const dz = s.fields.elevationM - zRef;
    const multiplier = 1 + (GRADIENT_PER_KM * dz) / 1000;
    const temperature = { times: [] as string[], values: [] as number[] };
    const precipitation = { times: [] as string[], values: [] as number[] };
    let error = 0;
    reference.dailyPrecipitation.times.forEach((time, i) => {
      const day = time.slice(0, 10);
      if (day < s.from || day > s.to) return;
      const mean = sums.get(day)!;
      error = 0.6 * error + 0.4 * Math.sqrt(1 - 0.36) * normal(random);
      temperature.times.push(time);
      temperature.values.push(Math.round((mean.sum / mean.n + lapse * dz + error) * 10) / 10);
      const p = reference.dailyPrecipitation.values[i];
      precipitation.times.push(time);
      precipitation.values.push(p > 0 ? Math.round(p * multiplier * Math.exp(0.3 * normal(random) - 0.045) * 10) / 10 : 0);
    });
    return { ...s, accuracy: statedAccuracy(s.fields), dailyTemperature: temperature, dailyPrecipitation: precipitation };
  });
  return cached;
}

/** The demo glacier system as separate glaciers for the volume–area relation (invented): the Sarvel and its tributaries, km², adding up to the bands' glacier area. */
export function demoGlacierAreasKm2(bandGlacierKm2: number): number[] {
  const named = [18, 9, 7, 5, 4];
  return [...named, Math.round((bandGlacierKm2 - named.reduce((a, b) => a + b, 0)) * 100) / 100];
}
