import { planRun } from '../../shared/analysis/run-plan';
import { inventedValley } from '../../shared/melt/fixtures/invented-valley';
import { scenarioChangesSchema } from '../../shared/schemas/scenarios';
import { DEFAULT_RUN_START } from '../../shared/schemas/runs';
import type { AppContext } from '../../server/context';
import type { JobPriority } from '../../server/queue/jobs';
import { insertBaseline } from '../../server/services/catchments/baseline-scenario';
import { saveRunInputs, seasonRunInputs, type RunInputs } from '../../server/services/runs/run-inputs';
import { TenantScope } from '../../server/services/tenant-scope';
import { unique } from './factories';
import { SEASON } from './runs';

/** Inputs of an invented-valley run (three bands, daily weather): a variant with `ensembleSize` members, or the baseline alone. */
export function valleyRunInputs(options: { ensembleSize?: number; blackCarbonSnowNgG?: number } = {}): RunInputs {
  const { catchment, forcing } = inventedValley({ bandCount: 3, years: 1, timeStep: 'daily' });
  const baseline = scenarioChangesSchema.parse({ period: SEASON });
  const changes = scenarioChangesSchema.parse({ period: SEASON, blackCarbonSnowNgG: options.blackCarbonSnowNgG ?? 300 });
  const plan = planRun({ changes, baselineChanges: baseline, attribution: false, ensembleSize: options.ensembleSize ?? 0, ensembleSeed: 7 },
    catchment.bands.map((b) => (b.lowerM + b.upperM) / 2));
  return seasonRunInputs({ catchment, forcing }, DEFAULT_RUN_START, plan.members);
}

/**
 * A run stored with the inputs given and queued, as the run service does after its checks: lets
 * queue tests give inputs the service would refuse (to see a failure for the input) or time it.
 */
export async function queueRun(ctx: AppContext, organisationId: number, inputs: RunInputs, priority: JobPriority = 'run'): Promise<number> {
  const runId = await storeQueuedRun(ctx, organisationId, inputs);
  await ctx.runQueue.enqueue({ runId, organisationId, memberCount: inputs.plans.length, priority });
  return runId;
}

/** The run row and inputs `queueRun` stores, without queueing its jobs (the queue benchmark times that part). */
export async function storeQueuedRun(ctx: AppContext, organisationId: number, inputs: RunInputs): Promise<number> {
  const scope = new TenantScope(ctx.db, organisationId);
  const catchmentId = await scope.insert('catchments', {
    name: unique('Queued basin '), description: '', latitude_deg: 46, longitude_deg: 9, time_zone: 'UTC', station_name: 'Camp', station_elevation_m: 2000, outlet_description: '',
  });
  await insertBaseline(scope, catchmentId, null);
  const scenario = (await scope.from('scenarios').where({ catchment_id: catchmentId }).first('id')).id as number;
  const runId = await scope.transaction(async (s) => {
    const id = await s.insert('runs', {
      catchment_id: catchmentId, scenario_id: scenario, scenario_name: 'Soot', is_baseline: false, changes: '{}', status: 'queued',
      engine_version: 'test', input_hash: unique('hash').padEnd(64, '0'), simulation_count: inputs.plans.length,
    });
    await saveRunInputs(s, id, inputs);
    return id;
  });
  return runId;
}

/** Waits until the run has ended and returns its row. */
export async function runEnded(ctx: AppContext, runId: number, timeoutMs = 60_000): Promise<{ status: string; error_message: string | null; progress: number }> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const row = await ctx.db('runs').where('id', runId).first('status', 'error_message', 'progress');
    if (row.status !== 'queued' && row.status !== 'running') return row;
    if (Date.now() > until) throw new Error(`run ${runId} still ${row.status} after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 50));
  }
}
