import type { Knex } from 'knex';
import { startRunSchema } from '../shared/schemas/runs';
import { loadConfig } from '../server/config';
import { createContext, type AppContext } from '../server/context';
import type { UserRow } from '../server/services/auth/auth-service';
import { TenantScope } from '../server/services/tenant-scope';
import { DEMO_ACCOUNTS, DEMO_ORGANISATION } from './data/demo-accounts';
import { DEMO_BRIEFING, DEMO_VARIANT_SCENARIO } from './data/demo-briefing';
import { DEMO_CATCHMENT } from './data/demo-catchment';
import { inProcessSimulator } from './data/in-process-simulations';

const accountOf = (role: 'consultant' | 'client') => DEMO_ACCOUNTS.find((a) => a.role === role)!;

/**
 * A finished baseline + variant run of the demo catchment and one published briefing on it, shared
 * with the demo client. Goes through the same services as the API. Safe to re-run: an identical
 * finished run is reused (by its input hash) and the briefing is found by title, published once.
 */
export async function seed(knex: Knex): Promise<void> {
  const organisation = await knex('organisations').where({ name: DEMO_ORGANISATION.name }).first('id');
  if (!organisation) throw new Error('Seed the demo organisation first (01_demo_organisation).');
  const scope = new TenantScope(knex, organisation.id);
  const catchment = await scope.from('catchments').where({ name: DEMO_CATCHMENT.name }).first('id');
  if (!catchment) throw new Error('Seed the demo catchment first (02_demo_catchment).');
  const scenario = await scope.from('scenarios').where({ catchment_id: catchment.id, name: DEMO_VARIANT_SCENARIO }).first('id');
  if (!scenario) throw new Error(`Seed the demo scenarios first (03_demo_scenarios): "${DEMO_VARIANT_SCENARIO}" is missing.`);
  const consultant = await scope.from<UserRow>('users').where({ email: accountOf('consultant').email }).first();
  if (!consultant) throw new Error('The demo consultant is missing; seed the demo organisation first.');

  // The API's own services, with the simulations on this thread.
  const ctx = createContext(loadConfig(), knex, { simulator: inProcessSimulator });
  try {
    await runAndPublish(ctx, scope, catchment.id, scenario.id, consultant);
  } finally {
    await ctx.close();
  }
}

async function runAndPublish(ctx: AppContext, scope: TenantScope, catchmentId: number, scenarioId: number, consultant: UserRow): Promise<void> {
  const { runs, briefings, briefingSharing: sharing } = ctx;
  const { run } = await runs.start(scope, catchmentId, startRunSchema.parse({ scenarioId }), consultant.id);
  await ctx.runExecutor.idle();
  const finished = await runs.get(scope, catchmentId, run.id);
  if (finished.status !== 'done') {
    // Left queued or running by an interrupted process; the server marks it failed on start-up and the next seed runs it afresh.
    console.warn(`Demo briefing skipped: run #${finished.id} is ${finished.status}${finished.errorMessage ? ` (${finished.errorMessage})` : ''}.`);
    return;
  }

  const selection = { runIds: [finished.id] };
  const existing = await scope.from('briefings').where({ catchment_id: catchmentId, title: DEMO_BRIEFING.title }).first('id', 'latest_version');
  const id: number = existing?.id
    ?? (await briefings.create(scope, consultant, { catchmentId, title: DEMO_BRIEFING.title, summary: DEMO_BRIEFING.summary, selection })).id;
  const published = Boolean(existing?.latest_version);
  if (!published) await briefings.saveDraft(scope, consultant, id, { ...DEMO_BRIEFING, selection });
  // Sharing is idempotent: on a re-run it restores a removed share and otherwise changes nothing.
  await sharing.share(scope, consultant, id, [accountOf('client').email]);
  if (!published) await briefings.publish(scope, consultant, id);
}
