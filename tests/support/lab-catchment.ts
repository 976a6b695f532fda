import type { Knex } from 'knex';
import { variableSpec, type Variable } from '../../shared/schemas/dataset-variables';
import { insertBandTable } from '../../server/services/catchments/band-tables';
import { insertBaseline } from '../../server/services/catchments/baseline-scenario';
import { insertReferenceStation } from '../../server/services/stations/reference-station';
import { insertDatasetValues, insertStakeReadings } from '../../server/services/catchments/dataset-values';
import { TenantScope } from '../../server/services/tenant-scope';
import { DEMO_BANDS, DEMO_CATCHMENT } from '../../seeds/data/demo-catchment';
import { demoStation } from '../../seeds/data/demo-forcing';
import { demoObservations } from '../../seeds/data/demo-observations';
import { unique } from './factories';
import { demoStations } from '../../seeds/data/demo-stations';
import { stationColumns } from '../../server/services/stations/station-rows';

/**
 * The demo catchment's bands and synthetic station record (seeds/data) stored for any
 * organisation (three hydrological years of climate from 2021-10-01, the demo's synthetic
 * discharge and stakes), so lab tests run on the demo climate.
 */
export async function createDemoCatchment(db: Knex, organisationId: number, options: { withDischarge?: boolean; withStations?: boolean } = {}): Promise<number> {
  const c = DEMO_CATCHMENT;
  const [catchmentId] = await db('catchments').insert({
    organisation_id: organisationId, name: unique('Sarvel '), description: c.description, latitude_deg: c.latitudeDeg, longitude_deg: c.longitudeDeg,
    time_zone: c.timeZone, station_name: c.stationName, station_elevation_m: c.stationElevationM, outlet_description: c.outletDescription,
  });
  await insertBaseline(new TenantScope(db, organisationId), catchmentId, null);
  const stationId = await insertReferenceStation(new TenantScope(db, organisationId), catchmentId, c.stationName, c.stationElevationM);
  await insertBandTable(new TenantScope(db, organisationId), catchmentId, DEMO_BANDS);
  const station = demoStation();
  const dataset = async (variable: Variable, step: 'hourly' | 'daily', first: string, last: string, count: number, station = stationId): Promise<number> => {
    const spec = variableSpec(variable);
    const [datasetId] = await db('datasets').insert({
      organisation_id: organisationId, catchment_id: catchmentId, station_id: spec.kind === 'climate' ? station : null, variable, kind: spec.kind,
      unit: spec.storedUnit, original_unit: spec.storedUnit, time_step: step, time_zone: c.timeZone, source: 'lab test', accuracy: 'invented', file_name: `${variable}.csv`, uploaded_by_name: 'test',
      first_at: first, last_at: last, value_count: count,
    });
    return datasetId;
  };
  const add = async (variable: Variable, step: 'hourly' | 'daily', series: { times: string[]; values: number[] }, station = stationId) => {
    const datasetId = await dataset(variable, step, series.times[0], series.times.at(-1)!, series.values.length, station);
    await insertDatasetValues(db, { datasetId, organisationId }, series.times, series.values);
  };
  if (options.withStations) {
    for (const s of demoStations()) {
      const id = await new TenantScope(db, organisationId).insert('stations', { catchment_id: catchmentId, ...stationColumns(s.fields), is_reference: false });
      await add('temperature', 'daily', s.dailyTemperature, id);
      await add('precipitation', 'daily', s.dailyPrecipitation, id);
    }
  }
  await add('temperature', 'hourly', station.hourlyTemperature);
  await add('precipitation', 'daily', station.dailyPrecipitation);
  if (options.withDischarge ?? true) {
    const observations = demoObservations();
    await add('discharge', 'daily', observations.dailyDischarge);
    const stakes = observations.stakes;
    await insertStakeReadings(db, { datasetId: await dataset('pointBalance', 'daily', stakes[0].from, stakes.at(-1)!.to, stakes.length), organisationId }, stakes);
  }
  return catchmentId;
}
