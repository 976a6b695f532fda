import type { Knex } from 'knex';
import { variableSpec, type Variable } from '../shared/schemas/dataset-variables';
import { BandService } from '../server/services/catchments/band-service';
import { insertBandTable } from '../server/services/catchments/band-tables';
import { insertBaseline } from '../server/services/catchments/baseline-scenario';
import { insertDatasetValues, insertStakeReadings } from '../server/services/catchments/dataset-values';
import { TenantScope } from '../server/services/tenant-scope';
import { DEMO_ACCOUNTS, DEMO_ORGANISATION } from './data/demo-accounts';
import { DEMO_BANDS, DEMO_CATCHMENT } from './data/demo-catchment';
import { syntheticStakeReadings } from './data/synthetic-stakes';
import { syntheticStation } from './data/synthetic-station';

/** Three hydrological years (October to September) of synthetic station data. */
const RECORD = { start: '2021-10-01', days: 1096, seed: 20211001 };
const SOURCE = 'Synthetic demo series (seed script, invented station)';

/**
 * The demo catchment of the demo consultancy, with its bands and synthetic temperature,
 * precipitation, discharge and stake readings. Safe to re-run: the catchment is found by name and its bands
 * and seeded datasets are replaced in one transaction.
 */
export async function seed(knex: Knex): Promise<void> {
  const organisation = await knex('organisations').where({ name: DEMO_ORGANISATION.name }).first('id');
  if (!organisation) throw new Error('Run 01_demo_organisation first: the demo consultancy is missing.');
  const organisationId: number = organisation.id;
  const consultant = DEMO_ACCOUNTS.find((a) => a.role === 'consultant')!;
  const user = await knex('users').where({ email: consultant.email }).first('id', 'name');
  const station = syntheticStation(RECORD);

  await knex.transaction(async (trx) => {
    const c = DEMO_CATCHMENT;
    const columns = {
      organisation_id: organisationId, name: c.name, description: c.description, latitude_deg: c.latitudeDeg, longitude_deg: c.longitudeDeg,
      time_zone: c.timeZone, station_name: c.stationName, station_elevation_m: c.stationElevationM, outlet_description: c.outletDescription,
      archived_at: null,
    };
    const existing = await trx('catchments').where({ organisation_id: organisationId, name: c.name }).first('id');
    const catchmentId: number = existing ? existing.id : (await trx('catchments').insert({ ...columns, created_by: user?.id ?? null }))[0];
    if (existing) await trx('catchments').where('id', catchmentId).update(columns);
    // A new catchment gets its baseline in the same transaction, as through the API.
    else await insertBaseline(new TenantScope(trx, organisationId), catchmentId, user?.id ?? null);

    // A re-run keeps the table in use when it is the demo table (runs point to it), else saves the demo table as a new version.
    const scope = new TenantScope(trx, organisationId);
    const inUse = await new BandService().list(scope, catchmentId);
    if (JSON.stringify(inUse) !== JSON.stringify(DEMO_BANDS)) await insertBandTable(scope, catchmentId, DEMO_BANDS, { userId: user?.id ?? null });

    const seeded = trx('datasets').where({ catchment_id: catchmentId, source: SOURCE }).select('id');
    await trx('dataset_values').whereIn('dataset_id', seeded.clone()).delete();
    await trx('stake_readings').whereIn('dataset_id', seeded.clone()).delete();
    await trx('datasets').whereIn('id', seeded).delete();

    const addDataset = async (variable: Variable, step: 'hourly' | 'daily', accuracy: string, fileName: string, range: { first: string; last: string; count: number }) => {
      const spec = variableSpec(variable);
      const [datasetId] = await trx('datasets').insert({
        organisation_id: organisationId, catchment_id: catchmentId, variable, kind: spec.kind, unit: spec.storedUnit, original_unit: spec.storedUnit,
        time_step: step, time_zone: c.timeZone, source: SOURCE, accuracy, file_name: fileName,
        uploaded_by: user?.id ?? null, uploaded_by_name: user?.name ?? 'Demo seed',
        first_at: range.first, last_at: range.last, value_count: range.count,
      });
      return { datasetId: datasetId as number, organisationId };
    };
    const add = async (variable: Variable, step: 'hourly' | 'daily', series: { times: string[]; values: number[] }, accuracy: string, fileName: string) => {
      const range = { first: series.times[0], last: series.times[series.times.length - 1], count: series.values.length };
      await insertDatasetValues(trx, await addDataset(variable, step, accuracy, fileName, range), series.times, series.values);
    };
    await add('temperature', 'hourly', station.hourlyTemperature, '±0.3 °C (invented)', 'kolvi-camp-temperature-hourly.csv');
    await add('precipitation', 'daily', station.dailyPrecipitation, '±10 %, undercatch of snow not corrected (invented)', 'kolvi-camp-precipitation-daily.csv');
    await add('discharge', 'daily', station.dailyDischarge, '±15 % at high flows (invented)', 'sarvel-gauge-discharge-daily.csv');
    const stakes = syntheticStakeReadings();
    const stakeRange = { first: stakes[0].from, last: stakes[stakes.length - 1].to, count: stakes.length };
    await insertStakeReadings(trx, await addDataset('pointBalance', 'daily', '±0.2 m w.e. (invented)', 'sarvel-stakes.csv', stakeRange), stakes);
  });
}
