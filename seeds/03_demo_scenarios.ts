import type { Knex } from 'knex';
import { SCENARIO_SCHEMA_VERSION, scenarioChangesSchema, type ScenarioChangesInput } from '../shared/schemas/scenarios';
import { warmingLevelDeltaC } from '../shared/analysis/warming-presets';
import { DEMO_ORGANISATION } from './data/demo-accounts';
import { DEMO_CATCHMENT } from './data/demo-catchment';

const SEASON = { from: '2024-04-01', to: '2024-09-30' };

/** Invented demo scenarios; the loads sit inside the ranges measured on Himalayan glaciers (Gul et al. 2022). */
const SCENARIOS: { name: string; description: string; isBaseline: boolean; changes: ScenarioChangesInput }[] = [
  { name: 'Baseline', description: 'The station record without changes.', isBaseline: true, changes: { period: SEASON } },
  {
    name: 'Black carbon, moderate', description: 'Soot from valley settlements settling on snow and bare ice.', isBaseline: false,
    changes: { period: SEASON, blackCarbonSnowNgG: 300, blackCarbonIceNgG: 1000 },
  },
  {
    name: 'Dust and 2 °C warming', description: 'Spring dust events and the 2 °C global warming level.', isBaseline: false,
    changes: { period: SEASON, dustSnowUgG: 50, dustIceUgG: 100, temperatureDeltaC: warmingLevelDeltaC('2'), warmingLevel: '2' },
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
