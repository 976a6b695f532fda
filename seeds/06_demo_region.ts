import type { Knex } from 'knex';
import { studyCreateSchema } from '../shared/schemas/studies';
import { warmingLevelDeltaC } from '../shared/analysis/warming-presets';
import { loadConfig } from '../server/config';
import { createContext } from '../server/context';
import { TenantScope } from '../server/services/tenant-scope';
import { createTableCatchments, readCatchmentTable } from '../server/services/studies/catchment-table';
import { DEMO_ACCOUNTS, DEMO_ORGANISATION } from './data/demo-accounts';
import { DEMO_CATCHMENT } from './data/demo-catchment';
import { DEMO_CALIBRATION } from './data/demo-calibration';
import { DEMO_REGION_NAMES, DEMO_STUDY, demoRegionTable } from './data/demo-region';

const SEASON = { from: '2024-04-01', to: '2024-09-30' };
const CALIBRATED = { parameters: DEMO_CALIBRATION.set.parameters, precipitationFactor: DEMO_CALIBRATION.set.precipitationFactor };

/**
 * The demo region: four more invented sub-catchments of the Dhenar valley (made from a catchment
 * table, with the Sarvel's station record) and a regional study of all five, started, so the
 * worker beside the server runs it. Safe to re-run: catchments and the study are found by name,
 * and a study already started is left as it is.
 */
export async function seed(knex: Knex): Promise<void> {
  const organisation = await knex('organisations').where({ name: DEMO_ORGANISATION.name }).first('id');
  if (!organisation) throw new Error('Seed the demo organisation first (01_demo_organisation).');
  const scope = new TenantScope(knex, organisation.id);
  const sarvel = await scope.from('catchments').where({ name: DEMO_CATCHMENT.name }).first('id');
  if (!sarvel) throw new Error('Seed the demo catchment first (02_demo_catchment).');
  const consultant = await scope.from('users').where({ email: DEMO_ACCOUNTS.find((a) => a.role === 'consultant')!.email }).first('id');
  const existing = await scope.from('catchments').whereIn('name', DEMO_REGION_NAMES).select('name');
  if (existing.length === 0) await createTableCatchments(scope, readCatchmentTable(demoRegionTable()), sarvel.id, consultant.id);
  if (await scope.from('studies').where({ name: DEMO_STUDY.name }).first('id')) return;

  const catchmentIds: number[] = [sarvel.id, ...(await scope.from('catchments').whereIn('name', DEMO_REGION_NAMES).orderBy('id').select('id')).map((r: { id: number }) => r.id)];
  const ctx = createContext(loadConfig(), knex);
  try {
    const study = await ctx.studies.create(scope, studyCreateSchema.parse({
      ...DEMO_STUDY, catchmentIds,
      templates: [
        { name: 'Valley soot', changes: { period: SEASON, ...CALIBRATED, blackCarbonSnowNgG: 100, blackCarbonIceNgG: 500 },
          // The Kolvi side valley lies beside the road: more soot there.
          values: [{ catchmentId: catchmentIds[1], blackCarbonSnowNgG: 160, blackCarbonIceNgG: 800 }] },
        { name: 'Dust and 2 °C warming', changes: { period: SEASON, ...CALIBRATED, dustSnowUgG: 20, dustIceUgG: 50, temperatureDeltaC: warmingLevelDeltaC('2'), warmingLevel: '2' } },
      ],
    }), consultant.id);
    // Queued only: the worker process beside the server runs it after start-up.
    await ctx.studies.start(scope, study.id, consultant.id);
  } finally {
    await ctx.close();
  }
}
