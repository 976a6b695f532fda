import type { Knex } from 'knex';
import { SCENARIO_SCHEMA_VERSION, scenarioChangesSchema, type ScenarioChangesInput } from '../shared/schemas/scenarios';
import { warmingLevelDeltaC } from '../shared/analysis/warming-presets';
import { DEMO_ORGANISATION } from './data/demo-accounts';
import { DEMO_CATCHMENT } from './data/demo-catchment';
import { DEMO_CALIBRATION } from './data/demo-calibration';

const SEASON = { from: '2024-04-01', to: '2024-09-30' };
/** Every demo scenario starts from the catchment's calibration, as the scenario builder does. */
const CALIBRATED = { parameters: DEMO_CALIBRATION.set.parameters, precipitationFactor: DEMO_CALIBRATION.set.precipitationFactor };

/**
 * Invented demo scenarios. Snow loads are added to the catchment's background (30 ng/g black
 * carbon, 10 µg/g dust in fresh snow) and enriched at the surface as the snow melts; with them the
 * surface loads of the melt season sit inside the ranges measured on Himalayan glaciers (Gul et al. 2022).
 */
const SCENARIOS: { name: string; description: string; isBaseline: boolean; changes: ScenarioChangesInput }[] = [
  { name: 'Baseline', description: 'The station record with today\'s background soot and dust.', isBaseline: true, changes: { period: SEASON, ...CALIBRATED } },
  {
    name: 'Black carbon, moderate', description: 'Soot from valley settlements: 100 ng/g more black carbon in fresh snow, 500 ng/g more on bare ice.', isBaseline: false,
    changes: { period: SEASON, ...CALIBRATED, blackCarbonSnowNgG: 100, blackCarbonIceNgG: 500 },
  },
  {
    name: 'Dust and 2 °C warming', description: 'Spring dust events (20 µg/g more dust in fresh snow, 50 µg/g more on ice) and the 2 °C global warming level.', isBaseline: false,
    changes: { period: SEASON, ...CALIBRATED, dustSnowUgG: 20, dustIceUgG: 50, temperatureDeltaC: warmingLevelDeltaC('2'), warmingLevel: '2' },
  },
];

/**
 * A baseline and two darkening variants for the demo catchment. Safe to re-run: scenarios are
 * found by name and their changes reset; runs are left alone.
 */
export async function seed(knex: Knex): Promise<void> {
  const organisation = await knex('organisations').where({ name: DEMO_ORGANISATION.name }).first('id');
  if (!organisation) throw new Error('Seed the demo organisation first (01_demo_organisation).');
  const catchment = await knex('catchments').where({ organisation_id: organisation.id, name: DEMO_CATCHMENT.name }).first('id');
  if (!catchment) throw new Error('Seed the demo catchment first (02_demo_catchment).');
  for (const s of SCENARIOS) {
    const columns = {
      description: s.description, is_baseline: s.isBaseline, schema_version: SCENARIO_SCHEMA_VERSION,
      changes: JSON.stringify(scenarioChangesSchema.parse(s.changes)), archived_at: null,
    };
    const existing = s.isBaseline
      ? await knex('scenarios').where({ catchment_id: catchment.id, is_baseline: true }).first('id')
      : await knex('scenarios').where({ catchment_id: catchment.id, name: s.name }).first('id');
    if (existing) await knex('scenarios').where('id', existing.id).update(columns);
    else await knex('scenarios').insert({ ...columns, organisation_id: organisation.id, catchment_id: catchment.id, name: s.name });
  }
}
