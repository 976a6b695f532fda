/**
 * npm run bench:api — the API under load on loopback: autocannon with 100 connections against
 * GET /api/health (no database, no session), GET /api/catchments (signed in, a tenant-scoped
 * database read; once with every connection signed in as the same user, as the figures in the
 * hardening issue were taken, and once with each connection a user of its own, so no two requests
 * can share a session check) and PUT /api/catchments/:id (signed in, a database write), each for a bounded
 * time, several rounds, printing req/s and latency p50/p99 beside the machine's load average
 * (other work on the machine shows in the figures).
 *
 * Runs against the database in the environment (DB_* variables, as the server), inside a
 * throw-away organisation (30 catchments of 21 bands) that is removed afterwards; 20 more
 * throw-away organisations of the same size stand for the other tenants a list must skip.
 * The API runs in a process of its own (scripts/bench/runs-server.ts).
 * BENCH_SECONDS (default 8) and BENCH_ROUNDS (default 3) bound the time; BENCH_ROUTES (health,
 * read, read-many, write; comma-separated, default all) picks routes, e.g. to profile one with BENCH_PROFILE_DIR.
 */
import autocannon from 'autocannon';
import bcrypt from 'bcryptjs';
import { availableParallelism, loadavg } from 'node:os';
import { loadConfig } from '../../server/config';
import { createDb } from '../../server/db';
import { DEMO_BANDS, DEMO_CATCHMENT } from '../../seeds/data/demo-catchment';
import { insertBandTable } from '../../server/services/catchments/band-tables';
import { TenantScope } from '../../server/services/tenant-scope';
import { sessionCookieName } from '../../server/middleware/require-auth';
import { signSessionToken } from '../../server/services/auth/session-tokens';
import { startApiProcess } from './api-process';

const SECONDS = Number(process.env.BENCH_SECONDS ?? 8);
const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 3);
const ONLY = process.env.BENCH_ROUTES ? process.env.BENCH_ROUTES.split(',').map((r) => r.trim()) : null;
const CONNECTIONS = 100;
const CATCHMENTS_PER_ORG = 30;
const OTHER_ORGS = 20;
const PASSWORD = 'benchmark-only-password';

const config = loadConfig();
const db = createDb(config.db);
const stamp = Date.now();
const organisationIds: number[] = [];

/** An organisation with a consultant and its catchments (with bands); the first catchment's id. */
async function addOrganisation(label: string, email?: string): Promise<number> {
  const [organisationId] = await db('organisations').insert({ name: `API benchmark ${label} ${stamp}` });
  organisationIds.push(organisationId);
  if (email) {
    await db('users').insert({ organisation_id: organisationId, email, name: 'Benchmark', role: 'consultant', status: 'active', password_hash: bcrypt.hashSync(PASSWORD, 4) });
  }
  const c = DEMO_CATCHMENT;
  const ids: number[] = [];
  for (let i = 0; i < CATCHMENTS_PER_ORG; i++) {
    const [id] = await db('catchments').insert({
      organisation_id: organisationId, name: `${c.name} ${i}`, description: c.description, latitude_deg: c.latitudeDeg, longitude_deg: c.longitudeDeg,
      time_zone: c.timeZone, station_name: c.stationName, station_elevation_m: c.stationElevationM, outlet_description: c.outletDescription,
    });
    ids.push(id);
  }
  const scope = new TenantScope(db, organisationId);
  for (const catchmentId of ids) await insertBandTable(scope, catchmentId, DEMO_BANDS);
  return ids[0]!;
}

interface Target {
  key: 'health' | 'read' | 'read-many' | 'write';
  label: string;
  method: 'GET' | 'PUT';
  path: string;
  body?: string;
  /** One session cookie per connection instead of the shared one. */
  cookiePerConnection?: boolean;
}

/** A consultant for each connection of the many-users read, with a session token made as sign-in makes it. */
async function addConsultants(organisationId: number): Promise<string[]> {
  const name = sessionCookieName(config.auth.cookieSecure);
  const hash = bcrypt.hashSync(PASSWORD, 4);
  const cookies: string[] = [];
  for (let i = 0; i < CONNECTIONS; i++) {
    const [userId] = await db('users').insert({
      organisation_id: organisationId, email: `bench.api.${stamp}.${i}@bench.invalid`, name: `Benchmark ${i}`, role: 'consultant', status: 'active', password_hash: hash,
    });
    const token = signSessionToken({ userId: userId!, organisationId, tokenVersion: 0 }, config.auth.jwtSecret, config.auth.sessionHours);
    cookies.push(`${name}=${token}`);
  }
  return cookies;
}

async function measure(origin: string, cookie: string, cookies: string[], target: Target) {
  const load = loadavg()[0];
  const result = await autocannon({
    url: `${origin}${target.path}`,
    method: target.method,
    connections: CONNECTIONS,
    duration: SECONDS,
    body: target.body,
    headers: { cookie, origin, 'content-type': 'application/json' },
    setupClient: target.cookiePerConnection
      ? (() => {
        let next = 0;
        return (client: autocannon.Client) => client.setHeaders({ cookie: cookies[next++ % cookies.length]!, origin, 'content-type': 'application/json' });
      })()
      : undefined,
  });
  const failed = result.non2xx + result.errors + result.timeouts;
  return { load, reqPerSec: result.requests.average, p50: result.latency.p50, p99: result.latency.p99, failed, answered: result.requests.total };
}

async function main(): Promise<void> {
  const email = `bench.api.${stamp}@bench.invalid`;
  const catchmentId = await addOrganisation('own', email);
  const cookies = await addConsultants(organisationIds[0]!);
  for (let i = 0; i < OTHER_ORGS; i++) await addOrganisation(`other ${i}`);
  const api = await startApiProcess();
  const origin = `http://127.0.0.1:${api.port}`;
  try {
    const signIn = await fetch(`${origin}/api/auth/sign-in`, {
      method: 'POST', headers: { 'Content-Type': 'application/json', Origin: origin }, body: JSON.stringify({ email, password: PASSWORD }),
    });
    if (!signIn.ok) throw new Error(`sign-in failed: ${signIn.status} ${await signIn.text()}`);
    const cookie = signIn.headers.get('set-cookie')!.split(';')[0]!;
    const c = DEMO_CATCHMENT;
    const form = {
      name: `${c.name} 0`, description: c.description, latitudeDeg: c.latitudeDeg, longitudeDeg: c.longitudeDeg, timeZone: c.timeZone,
      stationName: c.stationName, stationElevationM: c.stationElevationM, outletDescription: c.outletDescription,
    };
    const targets = ([
      { key: 'health', label: 'GET /api/health', method: 'GET', path: '/api/health' },
      { key: 'read', label: 'GET /api/catchments (signed in)', method: 'GET', path: '/api/catchments' },
      { key: 'read-many', label: `GET /api/catchments (${CONNECTIONS} users)`, method: 'GET', path: '/api/catchments', cookiePerConnection: true },
      { key: 'write', label: 'PUT /api/catchments/:id (signed in)', method: 'PUT', path: `/api/catchments/${catchmentId}`, body: JSON.stringify(form) },
    ] satisfies Target[]).filter((t) => ONLY === null || ONLY.includes(t.key));
    console.log(`bench:api — ${CONNECTIONS} connections, ${SECONDS} s per route, ${ROUNDS} rounds, ${availableParallelism()} cores`);
    const rows: Record<string, unknown>[] = [];
    let answered = 0;
    for (let round = 1; round <= ROUNDS; round++) {
      for (const target of targets) {
        const m = await measure(origin, cookie, cookies, target);
        rows.push({ round, route: target.label, ...m });
        answered += m.answered;
        console.log(`  round ${round}  ${target.label.padEnd(38)} ${m.reqPerSec.toFixed(0).padStart(6)} req/s  p50 ${String(m.p50).padStart(4)} ms  p99 ${String(m.p99).padStart(4)} ms` +
          `  load avg ${m.load.toFixed(2)}${m.failed ? `  (${m.failed} failed answers)` : ''}`);
      }
    }
    const { cpuMs } = await api.stop();
    // Throughput and latency move with whatever else the 2 cores run; the API's CPU time per answer hardly does.
    console.log(`  API process CPU per answer: ${((cpuMs! * 1000) / answered).toFixed(0)} µs (${answered} answers${targets.length > 1 ? ', all routes together' : ''})`);
    console.log(JSON.stringify(rows));
  } catch (error) {
    await api.stop();
    throw error;
  }
}

try {
  await main();
} finally {
  await db('organisations').whereIn('id', organisationIds).delete();
  await db.destroy();
}
