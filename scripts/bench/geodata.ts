/**
 * npm run bench:geodata — a 2000 × 2000 DEM (30 m cells, 60 × 60 km) with catchment, glacier and
 * debris outlines, uploaded through the HTTP API and derived to 30 bands of 100 m with 36 horizon
 * sectors and the sky-view factor (POST …/geodata/derivations, answered when the worker thread is
 * done; target under 10 s on a 2-core machine). Meanwhile it asks GET /api/health and a signed-in
 * GET every 25 ms and prints the slowest answer: the derivation runs in a worker thread, so the API
 * keeps answering.
 *
 * Runs against the database in the environment (DB_* variables, as the server), inside a
 * throw-away organisation removed afterwards; the API runs in a process of its own
 * (scripts/bench/runs-server.ts) so this client does not share its event loop.
 */
import bcrypt from 'bcryptjs';
import { rm } from 'node:fs/promises';
import path from 'node:path';
import { availableParallelism, loadavg } from 'node:os';
import { loadConfig } from '../../server/config';
import { createDb } from '../../server/db';
import { encodeGeoTiff } from '../../server/services/geodata/geotiff-writer';
import { crsFromEpsg } from '../../shared/geodata/crs';
import { valueNoise } from '../../shared/geodata/demo/value-noise';
import type { PolygonRings, Ring } from '../../shared/geodata/outline';
import type { Raster } from '../../shared/geodata/raster';
import { traceMask } from '../../shared/geodata/trace';
import { startApiProcess } from './api-process';

const SIZE = 2000;
const CELL = 30;
const SECTORS = Number(process.env.SECTORS ?? 36);
const PASSWORD = 'benchmark-only-password';

function benchDem(): Raster {
  const ridges = valueNoise(11, 9000, 7);
  const values = new Float32Array(SIZE * SIZE);
  for (let r = 0; r < SIZE; r++) {
    for (let c = 0; c < SIZE; c++) {
      const dome = 1 - Math.hypot(c - SIZE / 2, r - SIZE / 2) / (SIZE * 0.75);
      values[r * SIZE + c] = 2900 + 3600 * dome + 900 * ridges(c * CELL, r * CELL);
    }
  }
  return { width: SIZE, height: SIZE, x0: 400_000, y0: 3_800_000, dx: CELL, dy: CELL, values, crs: crsFromEpsg(32644, 'dem') };
}

function ellipse(dem: Raster, fraction: number): PolygonRings[] {
  const cx = dem.x0 + (SIZE * CELL) / 2;
  const cy = dem.y0 - (SIZE * CELL) / 2;
  const ring: Ring = Array.from({ length: 257 }, (_, k) => {
    const a = (-2 * Math.PI * (k % 256)) / 256;
    const r = fraction * (SIZE * CELL) * 0.5 * (1 + 0.08 * Math.sin(5 * a));
    return [cx + r * Math.cos(a), cy + 0.8 * r * Math.sin(a)] as [number, number];
  });
  return [[ring]];
}

/** GeoJSON in the DEM's UTM zone, named in the `crs` member as GIS tools write it. */
const geoJson = (polygons: PolygonRings[]) => JSON.stringify({
  type: 'FeatureCollection', crs: { type: 'name', properties: { name: 'urn:ogc:def:crs:EPSG::32644' } },
  features: [{ type: 'Feature', properties: {}, geometry: { type: 'MultiPolygon', coordinates: polygons } }],
});

const config = loadConfig();
const db = createDb(config.db);
const stamp = Date.now();
const [organisationId] = await db('organisations').insert({ name: `Geodata benchmark ${stamp}` });

async function main(): Promise<void> {
  await db('users').insert({
    organisation_id: organisationId, email: `geo.${stamp}@bench.invalid`, name: 'Benchmark', role: 'consultant', status: 'active', password_hash: bcrypt.hashSync(PASSWORD, 4),
  });
  const [catchmentId] = await db('catchments').insert({
    organisation_id: organisationId, name: 'Benchmark dome', description: '', latitude_deg: 33.9, longitude_deg: 79.9, time_zone: 'Asia/Kolkata',
    station_name: 'Benchmark station', station_elevation_m: 3500, outlet_description: '',
  });
  const dem = benchDem();
  const mask = (keep: (z: number, i: number) => boolean) => traceMask(Uint8Array.from(dem.values, (z, i) => (keep(z, i) ? 1 : 0)), dem);
  const files: [string, Blob, string][] = [
    ['dem', new Blob([encodeGeoTiff(dem).slice().buffer as ArrayBuffer]), 'dome-dem.tif'],
    ['catchmentOutline', new Blob([geoJson(ellipse(dem, 0.9))]), 'dome-catchment.geojson'],
    ['glacierOutline', new Blob([geoJson(mask((z) => z > 5300))]), 'dome-glaciers.geojson'],
    ['debrisOutline', new Blob([geoJson(mask((z, i) => z > 5300 && z < 5600 && (i % SIZE) % 50 < 25))]), 'dome-debris.geojson'],
  ];

  const api = await startApiProcess();
  try {
    await measure(api.port, catchmentId, files, api.stop);
  } finally {
    // A failed request must not leave the API process behind.
    await api.stop().catch(() => undefined);
  }
}

async function measure(port: number, catchmentId: number, files: [string, Blob, string][], stopApi: () => Promise<Record<string, number>>): Promise<void> {
  const base = `http://127.0.0.1:${port}/api`;
  const signIn = await fetch(`${base}/auth/sign-in`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ email: `geo.${stamp}@bench.invalid`, password: PASSWORD }) });
  // The session, and the header the API asks of every write (another site's form cannot send it).
  const signedIn = { Cookie: signIn.headers.get('set-cookie')!.split(';')[0], 'X-Requested-With': 'tarnish' };
  const geodata = `${base}/catchments/${catchmentId}/geodata`;
  for (const [layer, blob, name] of files) {
    const form = new FormData();
    form.append('file', blob, name);
    const res = await fetch(`${geodata}/uploads/${layer}`, { method: 'POST', headers: signedIn, body: form });
    if (!res.ok) throw new Error(`upload ${layer}: ${res.status} ${await res.text()}`);
  }

  let slowestMs = 0;
  let answers = 0;
  let pinging = true;
  const pinger = (async () => {
    while (pinging) {
      for (const url of [`${base}/health`, `${geodata}/uploads`]) {
        const t = performance.now();
        await fetch(url, { headers: signedIn });
        slowestMs = Math.max(slowestMs, performance.now() - t);
        answers++;
      }
      await new Promise((r) => setTimeout(r, 25));
    }
  })();
  const started = performance.now();
  const res = await fetch(`${geodata}/derivations`, {
    method: 'POST', headers: { ...signedIn, 'Content-Type': 'application/json' },
    body: JSON.stringify({ bandWidthM: 100, horizonSectors: SECTORS, debrisThicknessM: 0.2 }),
  });
  const seconds = (performance.now() - started) / 1000;
  pinging = false;
  await pinger;
  const loop = await stopApi();
  if (!res.ok) throw new Error(`derive: ${res.status} ${await res.text()}`);
  const { derivation } = await res.json() as { derivation: { bands: unknown[]; seconds: number; summary: { areaKm2: number; glacierAreaKm2: number } } };

  console.log(`geodata: ${SIZE} × ${SIZE} DEM (${CELL} m) → ${derivation.bands.length} bands of 100 m, ${SECTORS} horizon sectors, sky view and the map:`);
  console.log(`         ${seconds.toFixed(2)} s for the request (${derivation.seconds.toFixed(2)} s in the worker thread, reading the files included; target < 10 s)`);
  console.log(`         catchment ${derivation.summary.areaKm2.toFixed(0)} km², glacier ${derivation.summary.glacierAreaKm2.toFixed(0)} km²`);
  console.log(`         API answered ${answers} requests meanwhile; slowest ${slowestMs.toFixed(1)} ms; API event loop p99 ${loop.loopP99Ms.toFixed(1)} ms, max ${loop.loopMaxMs.toFixed(1)} ms`);
  console.log(`         machine load average ${loadavg()[0].toFixed(1)} on ${availableParallelism()} cores`);
}

try {
  await main();
} finally {
  await db('organisations').where('id', organisationId).delete();
  await rm(path.join(config.geodata.dir, String(organisationId)), { recursive: true, force: true });
  await db.destroy();
}
