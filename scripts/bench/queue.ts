/**
 * npm run bench:queue — the job queue's own cost and the worker processes' throughput.
 *
 * 1. Overhead per job: 200 one-member runs with a trivial simulation (one band, one day of a
 *    three-day record, no spin-up), one at a time, each timed from enqueue to the worker starting it and to its result
 *    stored (the job's completion, reported after the member is written). Prints p50/p99 (target: p99 < 20 ms).
 * 2. Throughput: a 20-catchment study (BENCH_CATCHMENTS for another size) — baseline + 2 variants over one season (each variant run
 *    simulates its paired baseline: 80 simulations) — with 1 and then 2 worker processes of one
 *    thread each, as simulations per second (target: 2 workers ≥ 1.7 × one), and the CPU time the
 *    worker, the database and the benchmark itself spend per simulation (what bounds the rate).
 *
 * Uses the database in the environment (DB_* variables, as the server) inside a throw-away
 * organisation removed afterwards, and the Redis of REDIS_PORT under a queue prefix of its own,
 * with worker processes it starts itself (not those of `npm start`).
 */
import { readFileSync } from 'node:fs';
import { availableParallelism, loadavg } from 'node:os';
import { QueueEvents } from 'bullmq';
import { planRun } from '../../shared/analysis/run-plan';
import { inventedValley } from '../../shared/melt/fixtures/invented-valley';
import { percentile } from '../../shared/analysis/percentiles';
import { scenarioChangesSchema } from '../../shared/schemas/scenarios';
import { DEFAULT_RUN_START } from '../../shared/schemas/runs';
import { parseConfig } from '../../server/config';
import { createContext } from '../../server/context';
import { createDb } from '../../server/db';
import { redisOptions } from '../../server/queue/connection';
import { memberJobId } from '../../server/queue/jobs';
import { spawnWorker, type WorkerProcess } from '../../server/queue/worker-process';
import { seasonRunInputs, type RunInputs } from '../../server/services/runs/run-inputs';
import { storeQueuedRun } from '../../tests/support/queued-runs';

const PREFIX = `bench-queue-${process.pid}`;
const SEASON = { from: '2022-04-01', to: '2022-09-30' };
const OVERHEAD_JOBS = 200;
const CATCHMENTS = Number(process.env.BENCH_CATCHMENTS ?? 20);

const env = { ...process.env, QUEUE_PREFIX: PREFIX, WORKER_THREADS: '1', LOG_LEVEL: 'warn', ORGANISATION_CONCURRENCY: '100' };
const config = parseConfig(env);
const db = createDb(config.db);
const ctx = createContext(config, db);
const events = new QueueEvents('simulations', { connection: redisOptions(config.queue), prefix: PREFIX });

function inputsOf(changes: object, bandCount: number, period: { from: string; to: string }, start: RunInputs['start'] = DEFAULT_RUN_START, days?: number): RunInputs {
  const valley = inventedValley({ bandCount, years: 1, timeStep: days ? 'daily' : 'hourly' });
  const { catchment } = valley;
  // A record of a few days keeps the trivial simulation (and its inputs) trivial.
  const forcing = days
    ? Object.fromEntries(Object.entries(valley.forcing).map(([k, v]) => [k, Array.isArray(v) ? v.slice(0, days) : v])) as typeof valley.forcing
    : valley.forcing;
  const plan = planRun({
    changes: scenarioChangesSchema.parse({ ...changes, period }), baselineChanges: scenarioChangesSchema.parse({ period }),
    attribution: false, ensembleSize: 0, ensembleSeed: 1,
  }, catchment.bands.map((b) => (b.lowerM + b.upperM) / 2));
  return seasonRunInputs({ catchment, forcing }, start, plan.members);
}

/** CPU seconds a process on this machine has used, all its threads together (Linux /proc; 100 clock ticks a second); null where it cannot be read. */
function cpuSeconds(pid: number | undefined): number | null {
  if (!pid) return null;
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    return (Number(fields[11]) + Number(fields[12])) / 100;
  } catch {
    return null;
  }
}

/** The database server's process id, when it runs on this machine and says where its pid file is. */
async function databasePid(): Promise<number | undefined> {
  try {
    const [rows] = await db.raw('SELECT @@pid_file AS file');
    return Number(readFileSync((rows as { file: string }[])[0].file, 'utf8').trim()) || undefined;
  } catch {
    return undefined;
  }
}

interface CpuUse { workers: number | null; database: number | null; benchmark: number }

function cpuNow(workerPids: (number | undefined)[], dbPid: number | undefined): CpuUse {
  const workers = workerPids.map(cpuSeconds);
  const { user, system } = process.cpuUsage();
  return { workers: workers.every((w) => w !== null) ? workers.reduce((a, w) => a! + w!, 0) : null, database: cpuSeconds(dbPid), benchmark: (user + system) / 1e6 };
}

async function startWorkers(count: number): Promise<WorkerProcess[]> {
  const started = Array.from({ length: count }, () => spawnWorker(env, { output: 'ignore' }));
  await Promise.all(started.map((w) => w.ready));
  return started;
}

/** Resolves when the job has completed (its member stored), with the time it completed. */
function completion(jobId: string): Promise<number> {
  return new Promise((resolve) => {
    const listener = ({ jobId: id }: { jobId: string }) => {
      if (id !== jobId) return;
      events.off('completed', listener);
      resolve(Date.now());
    };
    events.on('completed', listener);
  });
}

async function overhead(organisationId: number): Promise<{ toStart: number[]; toStored: number[]; inJob: number[] }> {
  // One band, one day of a three-day daily record, started from a given snow water equivalent: the simulation itself takes well under a millisecond.
  const trivial = inputsOf({}, 1, { from: '2021-10-02', to: '2021-10-02' }, { method: 'initial-swe', sweMm: [0] }, 3);
  trivial.plans = trivial.plans.filter((p) => p.kind === 'baseline');
  const toStart: number[] = [];
  const toStored: number[] = [];
  const inJob: number[] = [];
  for (let i = 0; i < OVERHEAD_JOBS + 10; i++) {
    const runId = await storeQueuedRun(ctx, organisationId, trivial);
    const jobId = memberJobId(runId, 0);
    const done = completion(jobId);
    const enqueued = Date.now();
    await ctx.runQueue.enqueue({ runId, organisationId, memberCount: 1, priority: 'run' });
    const stored = await done;
    const job = await ctx.queues.simulations.getJob(jobId);
    // The first few warm the worker's connections and threads.
    if (i < 10) continue;
    toStart.push((job?.processedOn ?? enqueued) - enqueued);
    toStored.push(stored - enqueued);
    // The job's own work (its run read, inputs, simulation and the stored member's transaction), as the worker timed it.
    if (job?.processedOn && job.finishedOn) inJob.push(job.finishedOn - job.processedOn);
  }
  return { toStart, toStored, inJob };
}

async function throughput(organisationId: number, workerCount: number): Promise<{ simulations: number; seconds: number; cpuMs: CpuUse | null }> {
  const variants = [{ blackCarbonSnowNgG: 200 + workerCount }, { blackCarbonSnowNgG: 200 + workerCount, temperatureDeltaC: 1.5 }];
  const runs: { runId: number; count: number }[] = [];
  for (let c = 0; c < CATCHMENTS; c++) {
    for (const v of variants) {
      const inputs = inputsOf(v, 6, SEASON);
      runs.push({ runId: await storeQueuedRun(ctx, organisationId, inputs), count: inputs.plans.length });
    }
  }
  const workers = await startWorkers(workerCount);
  const dbPid = await databasePid();
  const pids = workers.map((w) => w.child.pid);
  const cpuBefore = cpuNow(pids, dbPid);
  const started = Date.now();
  for (const r of runs) await ctx.runQueue.enqueue({ runId: r.runId, organisationId, memberCount: r.count, priority: 'study' });
  for (;;) {
    const open = await db('runs').whereIn('id', runs.map((r) => r.runId)).whereIn('status', ['queued', 'running']).count({ n: '*' }).first();
    if (Number(open!.n) === 0) break;
    await new Promise((r) => setTimeout(r, 100));
  }
  const seconds = (Date.now() - started) / 1000;
  const cpuAfter = cpuNow(pids, dbPid);
  await Promise.all(workers.map((w) => w.stop()));
  const simulations = runs.reduce((a, r) => a + r.count, 0);
  const perSimulation = (a: number | null, b: number | null) => (a === null || b === null ? null : ((b - a) * 1000) / simulations);
  return {
    simulations, seconds,
    cpuMs: { workers: perSimulation(cpuBefore.workers, cpuAfter.workers), database: perSimulation(cpuBefore.database, cpuAfter.database), benchmark: perSimulation(cpuBefore.benchmark, cpuAfter.benchmark)! },
  };
}

const ms = (v: number) => `${v.toFixed(1)} ms`;
const [organisationId] = await db('organisations').insert({ name: `Queue benchmark ${Date.now()}` });
try {
  await events.waitUntilReady();
  const [w] = await startWorkers(1);
  const { toStart, toStored, inJob } = await overhead(organisationId!);
  const queueShare = toStored.map((t, i) => t - (inJob[i] ?? 0));
  await w.stop();
  console.log(`bench:queue — ${OVERHEAD_JOBS} one-member runs with a trivial simulation, one at a time`);
  console.log(`  enqueue → worker starts it:  p50 ${ms(percentile(toStart, 50))}, p99 ${ms(percentile(toStart, 99))}`);
  console.log(`  enqueue → result stored:     p50 ${ms(percentile(toStored, 50))}, p99 ${ms(percentile(toStored, 99))}   (target p99 < 20 ms)`);
  console.log(`    of which the job's own work: p50 ${ms(percentile(inJob, 50))}, p99 ${ms(percentile(inJob, 99))}; the rest (queue, Redis, events): p50 ${ms(percentile(queueShare, 50))}, p99 ${ms(percentile(queueShare, 99))}`);
  const one = await throughput(organisationId!, 1);
  const two = await throughput(organisationId!, 2);
  const rate = (r: { simulations: number; seconds: number }) => r.simulations / r.seconds;
  console.log(`\n  ${CATCHMENTS}-catchment study, baseline + 2 variants, one season (6 bands, hourly): ${one.simulations} simulations`);
  console.log(`  1 worker process:  ${rate(one).toFixed(2)} simulations/s (${one.seconds.toFixed(1)} s)`);
  console.log(`  2 worker processes: ${rate(two).toFixed(2)} simulations/s (${two.seconds.toFixed(1)} s), ${(rate(two) / rate(one)).toFixed(2)} × one   (target ≥ 1.7 ×)`);
  // Where the time goes decides how far more workers (on more machines) carry: the workers' share grows with machines, the database's does not.
  const cpu = one.cpuMs!;
  const cpuText = (v: number | null) => (v === null ? 'not readable' : ms(v));
  console.log(`  CPU per simulation (1 worker): worker ${cpuText(cpu.workers)}, database ${cpuText(cpu.database)}, this benchmark ${cpuText(cpu.benchmark)}`);
  if (cpu.workers !== null && cpu.database !== null) {
    const all = cpu.workers + cpu.database + cpu.benchmark;
    console.log(`  so ${availableParallelism()} cores carry at most ${((availableParallelism() * 1000) / all).toFixed(0)} simulations/s here; one database core alone ${(1000 / cpu.database).toFixed(0)}/s`);
  }
  console.log(`  machine load average ${loadavg()[0].toFixed(1)} on ${availableParallelism()} cores`);
  console.log(JSON.stringify({
    overheadP50Ms: percentile(toStored, 50), overheadP99Ms: percentile(toStored, 99), startP99Ms: percentile(toStart, 99),
    jobWorkP99Ms: percentile(inJob, 99), queueShareP99Ms: percentile(queueShare, 99),
    oneWorkerPerSecond: rate(one), twoWorkersPerSecond: rate(two), speedUp: rate(two) / rate(one), loadAverage: loadavg()[0],
    workerCpuMsPerSimulation: one.cpuMs?.workers, databaseCpuMsPerSimulation: one.cpuMs?.database,
  }));
} finally {
  await db('organisations').where('id', organisationId).delete();
  await events.close();
  // The benchmark's own queues go with it.
  await ctx.queues.simulations.obliterate({ force: true });
  await ctx.queues.lab.obliterate({ force: true });
  await ctx.close();
  await db.destroy();
}
