import type { Knex } from 'knex';
import { startRunSchema } from '../shared/schemas/runs';
import { loadConfig } from '../server/config';
import { AuthService, type UserRow } from '../server/services/auth/auth-service';
import { BandService } from '../server/services/catchments/band-service';
import { BriefingService } from '../server/services/briefings/briefing-service';
import { BriefingSharing } from '../server/services/briefings/briefing-sharing';
import { RunsResultsSource } from '../server/services/briefings/runs-results-source';
import { ResultsService } from '../server/services/runs/results-service';
import { RunExecutor } from '../server/services/runs/run-executor';
import { RunService } from '../server/services/runs/run-service';
import { storedCatchmentInputs } from '../server/services/runs/stored-catchment-inputs';
import { ScenarioService } from '../server/services/runs/scenario-service';
import { createTeamServices } from '../server/services/team-services';
import { TenantScope } from '../server/services/tenant-scope';
import { DEMO_ACCOUNTS, DEMO_ORGANISATION } from './data/demo-accounts';
import { DEMO_BRIEFING, DEMO_VARIANT_SCENARIO } from './data/demo-briefing';
import { DEMO_CATCHMENT } from './data/demo-catchment';
import { InProcessSimulations } from './data/in-process-simulations';

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

  // Wired as in server/services/runs/run-services.ts, with the simulations on this thread.
  const executor = new RunExecutor(knex, new InProcessSimulations(), 1);
  const runs = new RunService(new ScenarioService(), storedCatchmentInputs(new BandService()), executor);
  const { run } = await runs.start(scope, catchment.id, startRunSchema.parse({ scenarioId: scenario.id }), consultant.id);
  await executor.idle();
  const finished = await runs.get(scope, catchment.id, run.id);
  if (finished.status !== 'done') {
    // Left queued or running by an interrupted process; the server marks it failed on start-up and the next seed runs it afresh.
    console.warn(`Demo briefing skipped: run #${finished.id} is ${finished.status}${finished.errorMessage ? ` (${finished.errorMessage})` : ''}.`);
    return;
  }

  const briefings = new BriefingService(new RunsResultsSource(new ResultsService(runs)));
  const sharing = new BriefingSharing(createTeamServices(loadConfig(), knex, new AuthService(knex, 10)).invitations);
  const selection = { runIds: [finished.id] };
  const existing = await scope.from('briefings').where({ catchment_id: catchment.id, title: DEMO_BRIEFING.title }).first('id', 'latest_version');
  const id: number = existing?.id
    ?? (await briefings.create(scope, consultant, { catchmentId: catchment.id, title: DEMO_BRIEFING.title, summary: DEMO_BRIEFING.summary, selection })).id;
  const published = Boolean(existing?.latest_version);
  if (!published) await briefings.saveDraft(scope, consultant, id, { ...DEMO_BRIEFING, selection });
  // Sharing is idempotent: on a re-run it restores a removed share and otherwise changes nothing.
  await sharing.share(scope, consultant, id, [accountOf('client').email]);
  if (!published) await briefings.publish(scope, consultant, id);
}
