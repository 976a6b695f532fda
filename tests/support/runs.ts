import type { Knex } from 'knex';
import { expect } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import type { Run } from '../../shared/schemas/runs';
import { inventedValley } from '../../shared/melt/fixtures/invented-valley';
import type { CatchmentInputSource } from '../../server/services/runs/catchment-inputs';
import { catchmentFields } from './catchments';
import { unique } from './factories';

/** One invented melt season, well inside the invented valley's climate record (which starts 2021-10-01). */
export const SEASON = { from: '2022-04-01', to: '2022-09-30' };

/**
 * Engine inputs from the invented valley (three bands, a year of daily weather) for any catchment
 * of the organisation: lets run tests exercise the queue, workers and results without uploading a season of CSV.
 */
export const inventedValleyInputs: CatchmentInputSource = async (scope, catchmentId) => {
  await scope.findOr404('catchments', catchmentId, 'Catchment');
  const { catchment, forcing } = inventedValley({ bandCount: 3, years: 1, timeStep: 'daily' });
  return { catchment, forcing };
};

/** A seat plan in good standing, written straight into the table the payment webhooks keep. */
export async function giveActivePlan(db: Knex, organisationId: number): Promise<void> {
  const ref = unique('sub_');
  await db('subscriptions').insert({
    organisation_id: organisationId, customer_ref: unique('cus_'), subscription_ref: ref, item_ref: unique('si_'),
    status: 'active', seats: 10,
  });
}

export async function createCatchment(agent: TestAgent): Promise<number> {
  const res = await agent.post('/api/catchments').send(catchmentFields());
  expect(res.status).toBe(201);
  return res.body.catchment.id as number;
}

/** Polls a run until it has finished (done, failed or cancelled). */
export async function waitForRun(agent: TestAgent, catchmentId: number, runId: number, timeoutMs = 60_000): Promise<Run> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const res = await agent.get(`/api/catchments/${catchmentId}/runs/${runId}`);
    expect(res.status).toBe(200);
    const run = res.body.run as Run;
    if (run.status === 'done' || run.status === 'failed' || run.status === 'cancelled') return run;
    if (Date.now() > until) throw new Error(`run ${runId} still ${run.status} after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 50));
  }
}
