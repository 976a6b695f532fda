/**
 * npm run bench:import — times the import of a 10-year hourly temperature CSV (87,600 rows):
 * decoding, parsing and checking the file on a worker thread (preview), then storing what was
 * read in one transaction (confirm), and how long the API's event loop was held up meanwhile (the longest any
 * other request, such as a health check, would have waited). Runs against the database in the environment (DB_* variables, as the
 * server), inside a throw-away organisation that is removed afterwards.
 */
import { loadavg } from 'node:os';
import { monitorEventLoopDelay } from 'node:perf_hooks';
import { catchmentFormSchema } from '../../shared/schemas/catchments';
import { datasetUploadFieldsSchema } from '../../shared/schemas/datasets';
import { loadConfig } from '../../server/config';
import { createContext } from '../../server/context';
import { createDb } from '../../server/db';
import { TenantScope } from '../../server/services/tenant-scope';

const HOURS = 87_600;

function hourlyFile(hours: number): Buffer {
  const lines = ['time,temperature_c'];
  const start = Date.UTC(2014, 0, 1);
  for (let h = 0; h < hours; h++) {
    const iso = new Date(start + h * 3_600_000).toISOString();
    const seasonal = -4 - 9 * Math.cos((2 * Math.PI * (h / 24 - 15)) / 365.25);
    const daily = 4 * Math.sin((2 * Math.PI * ((h % 24) - 9)) / 24);
    lines.push(`${iso.slice(0, 10)} ${iso.slice(11, 16)},${(seasonal + daily).toFixed(1)}`);
  }
  return Buffer.from(lines.join('\n'));
}

async function main(): Promise<void> {
  const config = loadConfig();
  const db = createDb(config.db);
  const ctx = createContext(config, db);
  const file = { originalname: 'ten-years-hourly.csv', buffer: hourlyFile(HOURS) };
  const [organisationId] = await db('organisations').insert({ name: `Import benchmark ${Date.now()}` });
  try {
    const [userId] = await db('users').insert({ organisation_id: organisationId, email: `bench.${Date.now()}@bench.invalid`, name: 'Benchmark', role: 'consultant' });
    const scope = new TenantScope(db, organisationId);
    const { id: catchmentId } = await ctx.catchments.create(scope, catchmentFormSchema.parse({
      name: 'Benchmark basin', description: '', latitudeDeg: 33, longitudeDeg: 75, timeZone: 'Asia/Kolkata', stationName: 'Bench', stationElevationM: 3000, outletDescription: '',
    }), userId);
    const { uploads } = ctx;
    const user = { id: userId, name: 'Benchmark' };
    const fields = datasetUploadFieldsSchema.parse({ variable: 'temperature', timeZone: 'Asia/Kolkata', source: 'Synthetic benchmark series' });
    const loop = monitorEventLoopDelay({ resolution: 5 });
    const longestStall = () => { const ms = loop.max / 1e6; loop.reset(); return ms; };
    loop.enable();
    const started = performance.now();
    const preview = await uploads.preview(scope, catchmentId, file, fields, user);
    const previewed = performance.now();
    const previewStallMs = longestStall();
    const dataset = await uploads.confirm(scope, catchmentId, preview.token, user);
    const stored = performance.now();
    const confirmStallMs = longestStall();
    loop.disable();
    if (dataset.valueCount !== HOURS) throw new Error(`stored ${dataset.valueCount} values, expected ${HOURS}`);
    console.log(`Imported ${HOURS.toLocaleString('en')} hourly rows (${(file.buffer.length / 1e6).toFixed(1)} MB):`);
    console.log(`  preview (read + checks, in a worker thread): ${((previewed - started) / 1000).toFixed(2)} s`);
    console.log(`  confirm (what the preview read, stored in one transaction): ${((stored - previewed) / 1000).toFixed(2)} s`);
    console.log(`  total: ${((stored - started) / 1000).toFixed(2)} s (target under 5 s)`);
    console.log(`  event loop held up at most ${previewStallMs.toFixed(0)} ms during preview, ${confirmStallMs.toFixed(0)} ms during confirm (load average ${loadavg()[0].toFixed(2)})`);
    // The upload limit's worth of file: previewed (read and checked) and discarded, not stored.
    const large = { originalname: 'fifty-years-hourly.csv', buffer: hourlyFile(HOURS * 5) };
    loop.enable();
    const largeStarted = performance.now();
    const largePreview = await uploads.preview(scope, catchmentId, large, fields, user);
    const largeMs = performance.now() - largeStarted;
    const largeStallMs = longestStall();
    loop.disable();
    await uploads.discard(scope, catchmentId, largePreview.token);
    console.log(`Previewed ${(HOURS * 5).toLocaleString('en')} hourly rows (${(large.buffer.length / 1e6).toFixed(1)} MB) in ${(largeMs / 1000).toFixed(2)} s; event loop held up at most ${largeStallMs.toFixed(0)} ms`);
  } finally {
    await db('organisations').where('id', organisationId).delete();
    await ctx.close();
    await db.destroy();
  }
}

await main();
