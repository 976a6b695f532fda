import type { Knex } from 'knex';
import { seed as seedOrganisation } from '../../seeds/01_demo_organisation';
import { seed as seedCatchment } from '../../seeds/02_demo_catchment';
import { seed as seedSubscription } from '../../seeds/02_demo_subscription';
import { seed as seedScenarios } from '../../seeds/03_demo_scenarios';
import { seed as seedBriefing } from '../../seeds/04_demo_briefing';
import { DEMO_ORGANISATION } from '../../seeds/data/demo-accounts';
import { DEMO_BRIEFING } from '../../seeds/data/demo-briefing';
import { DEMO_CATCHMENT } from '../../seeds/data/demo-catchment';

/** The ids of the seeded demo a browser test walks through. */
export interface DemoWorld {
  organisation: number;
  catchment: number;
  baseline: number;
  /** The newest finished run of the demo catchment. */
  run: number;
  /** The published demo briefing, shared with the demo client. */
  briefing: number;
}

/** Seeds the whole demo (as `npm run seed`, with its seat plan) and finds what the pages show. */
export async function seedDemoWorld(db: Knex): Promise<DemoWorld> {
  await seedOrganisation(db);
  await seedCatchment(db);
  await seedSubscription(db);
  await seedScenarios(db);
  await seedBriefing(db);
  const organisation = (await db('organisations').where({ name: DEMO_ORGANISATION.name }).first('id')).id as number;
  const catchment = (await db('catchments').where({ organisation_id: organisation, name: DEMO_CATCHMENT.name }).first('id')).id as number;
  const baseline = (await db('scenarios').where({ catchment_id: catchment, is_baseline: true }).first('id')).id as number;
  const run = (await db('runs').where({ catchment_id: catchment, status: 'done' }).orderBy('id', 'desc').first('id')).id as number;
  const briefing = (await db('briefings').where({ organisation_id: organisation, title: DEMO_BRIEFING.title }).first('id')).id as number;
  return { organisation, catchment, baseline, run, briefing };
}
