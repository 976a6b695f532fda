/**
 * npm run bench:lab — on the demo catchment (21 bands, hourly demo climate), through the API:
 * a 20 × 20 sweep of one melt season and a 3-parameter automatic calibration, each as a lab job
 * on the worker pool, while /api/health is called every 100 ms. Prints seconds for each and the
 * slowest health answer. Uses the database in the environment (DB_* variables, as the server),
 * inside a throw-away organisation that is removed afterwards. BENCH_TRACE=1 also prints when each
 * job starts and every health answer slower than 100 ms, to see what the API was doing then.
 */
import type { AddressInfo } from 'node:net';
import { monitorEventLoopDelay } from 'node:perf_hooks';
import bcrypt from 'bcryptjs';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/config';
import { JobQueues } from '../../server/queue/job-queues';
import { withWorkerProcess } from '../../server/queue/worker-process';
import { createContext } from '../../server/context';
import { createDb } from '../../server/db';
import { createDemoCatchment } from '../../tests/support/lab-catchment';
import { grantActivePlan } from '../../tests/support/paid-plan';

const PASSWORD = 'bench-only password 1';
const SEASON = { from: '2022-05-01', to: '2022-09-30' };

async function main(): Promise<void> {
  const config = loadConfig();
  const db = createDb(config.db);
  const ctx = createContext(config, db);
  const server = createApp(ctx, {}).listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}/api`;
  const [organisationId] = await db('organisations').insert({ name: `Lab benchmark ${Date.now()}` });
  try {
    const email = `bench.${Date.now()}@bench.invalid`;
    await db('users').insert({ organisation_id: organisationId, email, name: 'Benchmark', role: 'scientist', status: 'active', password_hash: bcrypt.hashSync(PASSWORD, 4) });
    await grantActivePlan(db, organisationId);
    const catchmentId = await createDemoCatchment(db, organisationId);
    const signIn = await fetch(`${base}/auth/sign-in`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ email, password: PASSWORD }) });
    const cookie = (signIn.headers.get('set-cookie') ?? '').split(';')[0];
    const call = async (path: string, body?: unknown) => {
      const res = await fetch(`${base}${path}`, { method: body ? 'POST' : 'GET', headers: { cookie, 'Content-Type': 'application/json' }, body: body ? JSON.stringify(body) : undefined });
      if (!res.ok) throw new Error(`${path}: ${res.status} ${await res.text()}`);
      return res.json();
    };

    const loopDelay = monitorEventLoopDelay({ resolution: 10 });
    loopDelay.enable();
    let slowestHealthMs = 0;
    let healthCalls = 0;
    let measuring = true;
    const pinger = (async () => {
      while (measuring) {
        const started = performance.now();
        await fetch(`${base}/health`);
        slowestHealthMs = Math.max(slowestHealthMs, performance.now() - started);
        if (performance.now() - started > 100 && process.env.BENCH_TRACE) console.log("slow health", (performance.now() - started).toFixed(0), "at", (started / 1000).toFixed(1));
        healthCalls++;
        await new Promise((r) => setTimeout(r, 100));
      }
    })();

    const timeJob = async (path: string, body: unknown) => {
      const started = performance.now();
      if (process.env.BENCH_TRACE) console.log('start', path, (started / 1000).toFixed(1));
      const job = await call(path, body);
      if (process.env.BENCH_TRACE) console.log('started', (performance.now() / 1000).toFixed(1));
      for (;;) {
        const now = await call(`/lab/jobs/${job.id}`);
        if (now.status !== 'running') {
          if (now.status !== 'done') throw new Error(`job ${job.id} ${now.status}: ${now.error}`);
          return { seconds: (performance.now() - started) / 1000, result: now.result };
        }
        await new Promise((r) => setTimeout(r, 200));
      }
    };
    const sweep = await timeJob(`/lab/catchments/${catchmentId}/sweeps`, {
      period: SEASON, axes: [{ variable: 'temperatureDeltaC', from: 0, to: 3, steps: 20 }, { variable: 'blackCarbonIceNgG', from: 0, to: 5000, steps: 20 }],
    });
    const calibration = await timeJob(`/lab/catchments/${catchmentId}/calibrations`, {
      keys: ['lapseRateCPerKm', 'temperatureRangeRadiationCoefficient', 'precipitationFactor'], period: SEASON, maxEvaluations: 120,
    });
    measuring = false;
    await pinger;
    loopDelay.disable();

    console.log(`Lab on the demo catchment (21 bands, hourly forcing), ${ctx.lab.pool.threads} worker thread(s):`);
    console.log(`  20 × 20 sweep of ${SEASON.from} … ${SEASON.to}: ${sweep.seconds.toFixed(1)} s (target under 30 s)`);
    console.log(`  3-parameter calibration, ${calibration.result.evaluations} model runs: ${calibration.seconds.toFixed(1)} s (target under 60 s);` +
      ` daily KGE ${calibration.result.startScores.daily.kge.toFixed(3)} → ${calibration.result.scores.daily.kge.toFixed(3)}`);
    console.log(`  /api/health meanwhile: slowest of ${healthCalls} answers ${slowestHealthMs.toFixed(0)} ms (target under 100 ms);` +
      ` longest event-loop stall ${(loopDelay.max / 1e6).toFixed(0)} ms`);
  } finally {
    await ctx.close();
    server.close();
    await db('organisations').where('id', organisationId).delete();
    await db.destroy();
  }
}

// The computations run on a worker process: the one of `npm start`, or one started for the benchmark.
const queues = new JobQueues(loadConfig().queue);
await withWorkerProcess(queues, main);
await queues.close();
