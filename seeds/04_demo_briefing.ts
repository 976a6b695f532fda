import type { Knex } from 'knex';
import { startRunSchema } from '../shared/schemas/runs';
import { loadConfig } from '../server/config';
import { createContext, type AppContext } from '../server/context';
import type { UserRow } from '../server/services/auth/auth-service';
import { TenantScope } from '../server/services/tenant-scope';
import { DEMO_ACCOUNTS, DEMO_ORGANISATION } from './data/demo-accounts';
import { DEMO_BRIEFING, DEMO_VARIANT_SCENARIO } from './data/demo-briefing';
import { DEMO_CATCHMENT } from './data/demo-catchment';
import { withWorkerProcess } from '../server/queue/worker-process';

/** How long the seed waits for the demo run (a season of three bands takes seconds). */
const DEMO_RUN_WAIT_MS = 5 * 60_000;

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

  // The API's own services; the run goes through the queue to a worker process like any other.
  const ctx = createContext(loadConfig(), knex);
  try {
    await withWorkerProcess(ctx.queues, () => runAndPublish(ctx, scope, catchment.id, scenario.id, consultant));
  } finally {
    await ctx.close();
  }
}

async function runAndPublish(ctx: AppContext, scope: TenantScope, catchmentId: number, scenarioId: number, consultant: UserRow): Promise<void> {
  const { runs, briefings, briefingSharing: sharing } = ctx;
  const { run } = await runs.start(scope, catchmentId, startRunSchema.parse({ scenarioId }), consultant.id);
  const finished = await runs.finished(scope, catchmentId, run.id, DEMO_RUN_WAIT_MS);
  if (finished.status !== 'done') {
    // Still queued after the wait (the workers are busy) or failed: the server's worker finishes it, and the next seed publishes.
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
