import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { simulateMember } from '../../shared/analysis/simulate-summary';
import type { SimulationSummary } from '../../shared/analysis/simulation-summary';
import { memberInput } from '../../server/services/runs/run-inputs';
import { storeMember } from '../../server/services/runs/run-store';
import { TenantScope } from '../../server/services/tenant-scope';
import { createOrganisation } from '../support/factories';
import { storeQueuedRun, valleyRunInputs } from '../support/queued-runs';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let scope: TenantScope;

beforeAll(async () => {
  t = createTestApp();
  scope = new TenantScope(t.db, (await createOrganisation(t.db)).organisationId);
});
afterAll(() => t.close());

describe('storing a run member', () => {
  it('stores a member once when two workers hand it in together, and finishes the run with its last member', async () => {
    const inputs = valleyRunInputs();
    expect(inputs.plans).toHaveLength(2);
    const runId = await storeQueuedRun(t.ctx, scope.organisationId, inputs);
    const [first, second] = inputs.plans.map((_, i) => simulateMember(memberInput(inputs, i)));
    // A job taken over after a stall while its first worker still ran: both store the same member at once.
    const outcomes = await Promise.all([storeMember(scope, runId, inputs.plans[0], first), storeMember(scope, runId, inputs.plans[0], first)]);
    expect(outcomes.map((o) => o.outcome).sort()).toEqual(['already-stored', 'stored']);
    expect(outcomes.every((o) => !o.finished)).toBe(true);
    const members = await t.db('run_members').where('run_id', runId).select('id');
    expect(members).toHaveLength(1);
    const days = await t.db('run_daily').where('member_id', members[0].id).count({ n: '*' }).first();
    expect(Number(days!.n)).toBe((first as SimulationSummary).dayCount);
    expect((await t.db('runs').where('id', runId).first('status', 'progress'))).toEqual({ status: 'running', progress: 0.5 });

    // Counting a member found stored (a retry that skipped the simulation) does not count it twice.
    expect(await storeMember(scope, runId, inputs.plans[0], null)).toEqual({ outcome: 'already-stored', finished: false });
    expect(await storeMember(scope, runId, inputs.plans[1], second)).toEqual({ outcome: 'stored', finished: true });
    expect((await t.db('runs').where('id', runId).first('status', 'progress'))).toEqual({ status: 'done', progress: 1 });
  });
});
