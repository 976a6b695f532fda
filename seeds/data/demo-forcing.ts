import { fillShortGaps } from '../../shared/melt/fill-gaps';
import type { SimulationInput } from '../../shared/melt/schema';
import { DEMO_BANDS, DEMO_CATCHMENT } from './demo-catchment';
import { syntheticStation, type SyntheticStation } from './synthetic-station';

/** Three hydrological years (October to September) of synthetic station data. */
export const DEMO_RECORD = { start: '2021-10-01', days: 1096, seed: 20211001 };

/** The demo station's record, generated once per process. */
let cached: SyntheticStation | null = null;
export function demoStation(): SyntheticStation {
  cached ??= syntheticStation(DEMO_RECORD);
  return cached;
}

const HOUR_MS = 3_600_000;

/**
 * The demo catchment and its station record as the engine takes them: hourly temperature on a
 * full grid (the 5-hour logger gap bridged as the product bridges short gaps) and daily
 * precipitation; the catchment's background loads.
 */
export function demoEngineInput(): Pick<SimulationInput, 'catchment' | 'forcing'> {
  const station = demoStation();
  const start = Date.parse(`${DEMO_RECORD.start}T00:00:00Z`);
  const grid: (number | null)[] = new Array<number | null>(DEMO_RECORD.days * 24).fill(null);
  station.hourlyTemperature.times.forEach((t, i) => {
    grid[(Date.parse(`${t.replace(' ', 'T')}:00Z`) - start) / HOUR_MS] = station.hourlyTemperature.values[i];
  });
  const c = DEMO_CATCHMENT;
  return {
    catchment: {
      latitudeDeg: c.latitudeDeg, longitudeDeg: c.longitudeDeg, timeZone: c.timeZone, stationElevationM: c.stationElevationM,
      bands: DEMO_BANDS, background: { blackCarbonSnowNgG: c.backgroundBlackCarbonNgG, dustSnowUgG: c.backgroundDustUgG },
    },
    forcing: {
      timeStep: 'hourly', start: DEMO_RECORD.start, temperatureC: fillShortGaps(grid, 6) as number[],
      precipitationMm: station.dailyPrecipitation.values, precipitationStep: 'daily',
    },
  };
}
