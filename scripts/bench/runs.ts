/**
 * npm run bench:runs — times runs through the HTTP API on the invented demo catchment (21 bands,
 * hourly station temperature, its three-year record): one melt season as baseline + one
 * black-carbon variant, then a 50-member Latin hypercube ensemble of the same variant, then a
 * 50-year multi-decade run of baseline and variant (warming to 3 °C above 1850–1900 by 2070, the
 * glacier updated every year), each end to end (start request → results read). Meanwhile it asks GET /api/health every 25 ms and reports the slowest answer, to show the
 * API is not blocked while the worker process simulates.
 *
 * Runs against the database in the environment (DB_* variables, as the server), inside a
 * throw-away organisation that is removed afterwards. The runs are simulated by the worker process
 * of `npm start` when one is connected, otherwise by one started for the benchmark. The API runs in a process
 * of its own (scripts/bench/runs-server.ts) so this client does not share its event loop. Each
 * invocation varies the variant's black carbon by a fraction of a ng/g so an earlier identical run
 * is never reused.
 */
import bcrypt from 'bcryptjs';
import { availableParallelism, loadavg } from 'node:os';
import { loadConfig } from '../../server/config';
import { JobQueues } from '../../server/queue/job-queues';
import { withWorkerProcess } from '../../server/queue/worker-process';
import { createDb } from '../../server/db';
import { insertBandTable } from '../../server/services/catchments/band-tables';
import { insertBaseline } from '../../server/services/catchments/baseline-scenario';
import { insertReferenceStation } from '../../server/services/stations/reference-station';
import { insertDatasetValues } from '../../server/services/catchments/dataset-values';
import { TenantScope } from '../../server/services/tenant-scope';
import { DEMO_BANDS, DEMO_CATCHMENT } from '../../seeds/data/demo-catchment';
import { demoStation } from '../../seeds/data/demo-forcing';
import { demoGlacierAreasKm2 } from '../../seeds/data/demo-stations';
import { startApiProcess } from './api-process';
import type { Run } from '../../shared/schemas/runs';

const SEASON = { from: '2024-04-01', to: '2024-09-30' };
const TRANSIENT = { fromYear: 2025, years: 50, warmingLevelC: 3, targetYear: 2070, regionalFactor: 1.5, precipitationChangePercent: 5 };
const PASSWORD = 'benchmark-only-password';

const config = loadConfig();
const db = createDb(config.db);
const stamp = Date.now();
const [organisationId] = await db('organisations').insert({ name: `Run benchmark ${stamp}` });

async function setUp(): Promise<number> {
  await db('users').insert({
    organisation_id: organisationId, email: `bench.${stamp}@bench.invalid`, name: 'Benchmark', role: 'consultant', status: 'active',
    password_hash: bcrypt.hashSync(PASSWORD, 4),
  });
  await db('subscriptions').insert({
    organisation_id: organisationId, customer_ref: `cus_bench_${stamp}`, subscription_ref: `sub_bench_${stamp}`, item_ref: `si_bench_${stamp}`, status: 'active', seats: 5,
  });
  const c = DEMO_CATCHMENT;
  const [catchmentId] = await db('catchments').insert({
    organisation_id: organisationId, name: c.name, description: c.description, latitude_deg: c.latitudeDeg, longitude_deg: c.longitudeDeg,
    time_zone: c.timeZone, station_name: c.stationName, station_elevation_m: c.stationElevationM, outlet_description: c.outletDescription,
  });
  await insertBaseline(new TenantScope(db, organisationId), catchmentId, null);
  const stationId = await insertReferenceStation(new TenantScope(db, organisationId), catchmentId, c.stationName, c.stationElevationM);
  await insertBandTable(new TenantScope(db, organisationId), catchmentId, DEMO_BANDS);
  const station = demoStation();
  const add = async (variable: string, kind: string, unit: string, step: string, series: { times: string[]; values: number[] }) => {
    const [datasetId] = await db('datasets').insert({
      organisation_id: organisationId, catchment_id: catchmentId, station_id: kind === 'climate' ? stationId : null, variable, kind, unit, original_unit: unit, time_step: step, time_zone: c.timeZone,
      source: 'Synthetic benchmark series', accuracy: '', file_name: 'bench.csv', uploaded_by_name: 'Benchmark',
      first_at: series.times[0], last_at: series.times.at(-1), value_count: series.values.length,
    });
    await insertDatasetValues(db, { datasetId, organisationId }, series.times, series.values);
  };
  await add('temperature', 'climate', '°C', 'hourly', station.hourlyTemperature);
  await add('precipitation', 'climate', 'mm', 'daily', station.dailyPrecipitation);
  return catchmentId;
}

async function main(): Promise<void> {
  const catchmentId = await setUp();
  const api = await startApiProcess();
  const base = `http://127.0.0.1:${api.port}/api`;

  const signIn = await fetch(`${base}/auth/sign-in`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ email: `bench.${stamp}@bench.invalid`, password: PASSWORD }) });
  const cookie = signIn.headers.get('set-cookie')!.split(';')[0];
  const call = async (method: string, path: string, body?: unknown) => {
    const res = await fetch(`${base}${path}`, { method, headers: { Cookie: cookie, 'Content-Type': 'application/json' }, body: body === undefined ? undefined : JSON.stringify(body) });
    if (!res.ok) throw new Error(`${method} ${path}: ${res.status} ${await res.text()}`);
    return res.json();
  };

  let slowestHealthMs = 0;
  let healthChecks = 0;
  let pinging = true;
  const pinger = (async () => {
    while (pinging) {
      const t = performance.now();
      await fetch(`${base}/health`);
      slowestHealthMs = Math.max(slowestHealthMs, performance.now() - t);
      healthChecks++;
      await new Promise((r) => setTimeout(r, 25));
    }
  })();

  const scenarios = (await call('GET', `/catchments/${catchmentId}/scenarios`)).scenarios;
  await call('PATCH', `/catchments/${catchmentId}/scenarios/${scenarios[0].id}`, { changes: { period: SEASON } });
  const variant = (await call('POST', `/catchments/${catchmentId}/scenarios`, {
    name: 'Black carbon 400/1500 ng/g', changes: { blackCarbonSnowNgG: 400 + (stamp % 1000) / 1e4, blackCarbonIceNgG: 1500 },
  })).scenario;

  const timeRun = async (body: object, results = 'results') => {
    const started = performance.now();
    let run: Run = (await call('POST', `/catchments/${catchmentId}/runs`, { scenarioId: variant.id, ...body })).run;
    while (run.status === 'queued' || run.status === 'running') {
      await new Promise((r) => setTimeout(r, 20));
      run = (await call('GET', `/catchments/${catchmentId}/runs/${run.id}`)).run;
    }
    if (run.status !== 'done') throw new Error(`run ${run.id} ended ${run.status}: ${run.errorMessage}`);
    const read = await call('GET', `/catchments/${catchmentId}/runs/${run.id}/${results}`);
    return { seconds: (performance.now() - started) / 1000, run, results: read.results };
  };

  const single = await timeRun({});
  const ensemble = await timeRun({ ensembleSize: 50 });
  const glacierKm2 = DEMO_BANDS.reduce((s, b) => s + b.areaKm2 * b.glacierFraction, 0);
  await call('PUT', `/catchments/${catchmentId}/water`, { glacier: { method: 'volume-area', glacierAreasKm2: demoGlacierAreasKm2(glacierKm2) } });
  const transient = await timeRun({ transient: TRANSIENT }, 'years');
  pinging = false;
  await pinger;
  const loop = await api.stop();

  const days = single.results.dayCount;
  console.log(`Demo catchment, ${DEMO_BANDS.length} bands, ${days} days hourly (${SEASON.from} … ${SEASON.to}), ${config.workerThreads} thread(s) in the worker process:`);
  console.log(`  one season, baseline + variant (${single.run.simulationCount} simulations): ${single.seconds.toFixed(2)} s end to end (target under 2 s)`);
  console.log(`  50-member ensemble (${ensemble.run.simulationCount} simulations): ${ensemble.seconds.toFixed(2)} s end to end`);
  console.log(`  added melt: ${single.results.totals.addedVolumeMillionM3.toFixed(3)} million m³; ensemble 5–95 %: ` +
    `${(ensemble.results.ensemble.totals.addedVolumeM3.p5 / 1e6).toFixed(3)} … ${(ensemble.results.ensemble.totals.addedVolumeM3.p95 / 1e6).toFixed(3)} million m³`);
  console.log(`  50-year multi-decade run, baseline + variant (${transient.run.simulationCount} simulations of ${TRANSIENT.years} years): ${transient.seconds.toFixed(2)} s end to end (target under 20 s); `
    + `peak water baseline ${transient.results.baseline.peakWater.text}, variant ${transient.results.variant.peakWater.text}`);
  console.log(`  health answered ${healthChecks} times while runs were busy; slowest ${slowestHealthMs.toFixed(1)} ms (${slowestHealthMs < 100 ? 'under' : 'NOT under'} 100 ms)`);
  // The API process's own event loop; its delay also counts time the OS gave the CPU to other processes (see the load average).
  console.log(`  API event loop: delay p99 ${loop.loopP99Ms.toFixed(1)} ms, max ${loop.loopMaxMs.toFixed(1)} ms, busy ${(loop.busyShare * 100).toFixed(0)} % of the time; machine load average ${loadavg()[0].toFixed(1)} on ${availableParallelism()} cores`);
  console.log(JSON.stringify({
    singleSeasonSeconds: single.seconds, ensembleSeconds: ensemble.seconds, transientSeconds: transient.seconds, slowestHealthMs, apiNeverBlocked: slowestHealthMs < 100, ...loop, loadAverage: loadavg()[0],
  }));
}

// The runs go to a worker process: the one of `npm start`, or one started for the benchmark.
const queues = new JobQueues(config.queue);
try {
  await withWorkerProcess(queues, main);
} finally {
  await queues.close();
  await db('organisations').where('id', organisationId).delete();
  await db.destroy();
}
