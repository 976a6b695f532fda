import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { catchmentContribution } from '../../shared/analysis/regional-totals';
import { spawnWorker, type WorkerProcess } from '../../server/queue/worker-process';
import { OrganisationSlots } from '../../server/queue/organisation-slots';
import { createRedis } from '../../server/queue/connection';
import { loadMembers } from '../../server/services/runs/run-store';
import { TenantScope } from '../../server/services/tenant-scope';
import { sweepResultSchema } from '../../shared/schemas/lab';
import { createOrganisation, signedInAgent, type TestOrg } from '../support/factories';
import { createDemoCatchment } from '../support/lab-catchment';
import { waitForJob } from '../support/lab-jobs';
import { grantActivePlan } from '../support/paid-plan';
import { queueRun, runEnded, valleyRunInputs } from '../support/queued-runs';
import { startTestRedis, type TestRedis } from '../support/redis-server';
import { createTestApp, type TestApp } from '../support/test-app';

/**
 * The queue under faults, with real worker processes and a Redis of this file's own (so it can be
 * restarted): workers killed mid-run, Redis and the API restarted mid-run, cancel, priorities and the
 * per-organisation limit. Locks last two seconds here, so a killed worker's jobs come back quickly.
 */
let redis: TestRedis;
let t: TestApp;
let org: TestOrg;
let env: Record<string, string>;
const workers: WorkerProcess[] = [];

async function worker(extra: Record<string, string> = {}): Promise<WorkerProcess> {
  const w = spawnWorker({ ...env, ...extra }, { output: 'ignore' });
  workers.push(w);
  await w.ready;
  return w;
}

async function stopWorkers(): Promise<void> {
  await Promise.all(workers.splice(0).map((w) => w.stop()));
}

const storedMembers = async (runId: number) => Number((await t.db('run_members').where('run_id', runId).count({ n: '*' }).first())!.n);

async function totalsOf(runId: number) {
  const members = await loadMembers(new TenantScope(t.db, org.organisationId), runId);
  const c = catchmentContribution(members);
  return { members: members.length, addedVolumeM3: c.addedVolumeM3, ensemble: [...c.ensembleAddedM3.entries()].sort(([a], [b]) => a - b) };
}

async function until(check: () => Promise<boolean>, timeoutMs = 60_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > deadline) throw new Error('timed out waiting');
    await new Promise((r) => setTimeout(r, 50));
  }
}

beforeAll(async () => {
  redis = await startTestRedis();
  env = { REDIS_PORT: String(redis.port), QUEUE_PREFIX: 'faults', QUEUE_LOCK_SECONDS: '2', WORKER_THREADS: '1', LOG_LEVEL: 'silent' };
  t = createTestApp(env);
  org = await createOrganisation(t.db);
}, 60_000);
afterAll(async () => {
  await stopWorkers();
  await t?.close();
  await redis?.remove();
});

describe('the job queue under faults', () => {
  let reference: Awaited<ReturnType<typeof totalsOf>>;
  const ensemble = valleyRunInputs({ ensembleSize: 8 });

  it('completes a run through the queue with one worker process', async () => {
    await worker();
    const runId = await queueRun(t.ctx, org.organisationId, ensemble);
    expect((await runEnded(t.ctx, runId)).status).toBe('done');
    reference = await totalsOf(runId);
    expect(reference.members).toBe(ensemble.plans.length);
    expect(reference.ensemble).toHaveLength(8);
  });

  it('finishes a run once, with the same totals, when its worker is killed (SIGKILL) mid-ensemble', async () => {
    const doomed = workers[0];
    const runId = await queueRun(t.ctx, org.organisationId, ensemble);
    await until(async () => (await storedMembers(runId)) >= 2);
    expect((await t.db('runs').where('id', runId).first('status')).status).toBe('running');
    doomed.child.kill('SIGKILL');
    await doomed.stop();
    workers.splice(0);
    // Another worker takes the killed one's jobs once their locks lapse (stalled-job detection).
    await worker();
    expect((await runEnded(t.ctx, runId)).status).toBe('done');
    expect(await totalsOf(runId)).toEqual(reference);
  });

  it('finishes a run when Redis restarts in the middle of it; nothing queued is lost', async () => {
    const runId = await queueRun(t.ctx, org.organisationId, ensemble);
    await until(async () => (await storedMembers(runId)) >= 2);
    await redis.stop();
    expect(await storedMembers(runId)).toBeLessThan(ensemble.plans.length);
    await new Promise((r) => setTimeout(r, 500));
    await redis.start();
    expect((await runEnded(t.ctx, runId, 90_000)).status).toBe('done');
    expect(await totalsOf(runId)).toEqual(reference);
  });

  it('shows a run\'s progress from the database after the API restarts, while the workers finish it', async () => {
    const runId = await queueRun(t.ctx, org.organisationId, ensemble);
    await until(async () => (await storedMembers(runId)) >= 2);
    const { catchment_id: catchmentId } = await t.db('runs').where('id', runId).first('catchment_id');
    expect(await storedMembers(runId)).toBeLessThan(ensemble.plans.length);
    await t.close();
    t = createTestApp(env);
    const run = await t.ctx.runs.get(new TenantScope(t.db, org.organisationId), catchmentId, runId);
    expect(run.progress).toBeGreaterThan(0);
    expect(['running', 'done']).toContain(run.status);
    expect((await runEnded(t.ctx, runId)).status).toBe('done');
    expect(await totalsOf(runId)).toEqual(reference);
  });

  it('cancel leaves no job of the run waiting or running', async () => {
    const runId = await queueRun(t.ctx, org.organisationId, valleyRunInputs({ ensembleSize: 30 }));
    await until(async () => (await storedMembers(runId)) >= 1);
    await t.ctx.runs.cancelOpen(new TenantScope(t.db, org.organisationId), [runId]);
    await until(async () => {
      const open = await t.ctx.queues.simulations.getJobs(['waiting', 'prioritized', 'active', 'delayed']);
      return open.every((j) => j.data.runId !== runId);
    }, 20_000);
    const stored = await storedMembers(runId);
    await new Promise((r) => setTimeout(r, 1000));
    expect(await storedMembers(runId)).toBe(stored);
    expect((await t.db('runs').where('id', runId).first('status')).status).toBe('cancelled');
  });

  it('starts a single run queued behind a 200-job study run before that study run is half done', async () => {
    const study = valleyRunInputs({ ensembleSize: 99 });
    expect(study.plans).toHaveLength(200);
    const studyRun = await queueRun(t.ctx, org.organisationId, study, 'study');
    await until(async () => (await storedMembers(studyRun)) >= 1);
    const single = await queueRun(t.ctx, org.organisationId, valleyRunInputs({ blackCarbonSnowNgG: 450 }), 'run');
    expect((await runEnded(t.ctx, single)).status).toBe('done');
    // Ordering, not speed: the single run went ahead of the study's waiting jobs.
    expect(await storedMembers(studyRun)).toBeLessThan(100);
    await t.ctx.runs.cancelOpen(new TenantScope(t.db, org.organisationId), [studyRun]);
  });

  it('keeps each organisation within its limit of simulations at once, so another organisation is served meanwhile', async () => {
    await stopWorkers();
    await Promise.all([worker({ ORGANISATION_CONCURRENCY: '1' }), worker({ ORGANISATION_CONCURRENCY: '1' })]);
    const busy = await queueRun(t.ctx, org.organisationId, valleyRunInputs({ ensembleSize: 20 }), 'study');
    const other = await createOrganisation(t.db);
    await until(async () => (await storedMembers(busy)) >= 1);
    const small = await queueRun(t.ctx, other.organisationId, valleyRunInputs({ ensembleSize: 1 }), 'study');
    const client = createRedis(t.config.queue);
    const slots = new OrganisationSlots(client, 'faults', 1, 5000);
    const held: number[] = [];
    while ((await t.db('runs').where('id', small).first('status')).status !== 'done') {
      held.push(await slots.held(org.organisationId));
      await new Promise((r) => setTimeout(r, 20));
    }
    client.disconnect();
    // Two workers with two job places each, yet the first organisation never simulated two at once.
    expect(Math.max(...held)).toBe(1);
    // The other organisation's run finished while the first one's was still going.
    expect((await t.db('runs').where('id', busy).first('status')).status).toBe('running');
    await t.ctx.runs.cancelOpen(new TenantScope(t.db, org.organisationId), [busy]);
  });

  it('finishes a lab sweep whose worker is killed (SIGKILL) mid-job: another worker takes the job over', async () => {
    await stopWorkers();
    const doomed = await worker();
    await grantActivePlan(t.db, org.organisationId);
    const catchmentId = await createDemoCatchment(t.db, org.organisationId, { withDischarge: false });
    const scientist = await signedInAgent(t.app, org.users.scientist.email);
    const started = await scientist.post(`/api/lab/catchments/${catchmentId}/sweeps`)
      .send({ period: { from: '2022-06-01', to: '2022-08-31' }, axes: [{ variable: 'temperatureDeltaC', from: 0, to: 2, steps: 5 }, { variable: 'blackCarbonIceNgG', from: 0, to: 1000, steps: 4 }] });
    expect(started.status, JSON.stringify(started.body)).toBe(202);
    await until(async () => (await t.db('lab_jobs').where('id', started.body.id).first('status')).status === 'running');
    doomed.child.kill('SIGKILL');
    await doomed.stop();
    workers.splice(0);
    await worker();
    const job = await waitForJob(scientist, started.body.id);
    expect(job.status, job.error ?? '').toBe('done');
    const result = sweepResultSchema.parse(job.result);
    expect(result.meltMm.flat()).toHaveLength(20);
    expect(result.meltMm.flat().every((v) => Number.isFinite(v) && v > 0)).toBe(true);
  });
});

