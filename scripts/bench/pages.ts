/// <reference lib="dom" />
/**
 * npm run bench:pages — what a browser transfers on a cold load (empty cache, fresh page) of each
 * main page, signed in as the demo admin (the client for the client's briefing), until the page's
 * content is drawn (a chart's canvas on chart pages) and the network is idle:
 *
 * - JS at first paint: compressed JavaScript received by the moment the page's heading was drawn;
 * - JS in all: compressed JavaScript of the whole load, chart code included (the figure the
 *   250 kB target of chart pages is about);
 * - total: every byte on the wire (scripts, styles, fonts, API replies, headers included), as the
 *   server sends them (brotli or gzip, as Chromium asks).
 *
 * Serves the built client (run `npm run build` first) and the API in this process on a free port,
 * against the database in the environment (DB_* variables) holding the demo (`npm start` seeds it).
 * The compared and multi-decade results need two more runs of the demo catchment: the first time
 * they are missing they are started here and simulated by a worker process (a minute or two).
 * `BENCH_PAGES_DETAIL=1` lists every file of every page with its type and size.
 */
import type { AddressInfo } from 'node:net';
import type { Page } from 'playwright-core';
import { startRunSchema, type StartRun } from '../../shared/schemas/runs';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/config';
import { createContext } from '../../server/context';
import { createDb } from '../../server/db';
import { createLogger } from '../../server/logger';
import { withWorkerProcess } from '../../server/queue/worker-process';
import { TenantScope } from '../../server/services/tenant-scope';
import { DEMO_ACCOUNTS, DEMO_ORGANISATION } from '../../seeds/data/demo-accounts';
import { DEMO_BRIEFING, DEMO_VARIANT_SCENARIO } from '../../seeds/data/demo-briefing';
import { DEMO_CATCHMENT } from '../../seeds/data/demo-catchment';
import { DEMO_STUDY } from '../../seeds/data/demo-region';
import { launchBrowser } from '../../tests/support/browser';

/** The second variant compared with the demo's run, and the multi-decade run of the demo's variant. */
const COMPARED_SCENARIO = 'Dust and 2 °C warming';
const TRANSIENT = { fromYear: 2030, years: 15, warmingLevelC: 2, targetYear: 2060 };
const RUN_WAIT_MS = 10 * 60_000;
const detail = process.env.BENCH_PAGES_DETAIL === '1';

const config = loadConfig();
const logger = createLogger({ ...config.log, level: 'silent' });
const db = createDb(config.db, logger);
const ctx = createContext(config, db, { logger });
const server = createApp(ctx, { clientDir: 'dist' }).listen(0, '127.0.0.1');
await new Promise<void>((resolve) => server.once('listening', () => resolve()));
const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;

const organisation = await db('organisations').where({ name: DEMO_ORGANISATION.name }).first('id');
if (!organisation) throw new Error('The demo is missing from this database: run npm start (or npm run seed) first.');
const scope = new TenantScope(db, organisation.id);
const catchment = await scope.from('catchments').where({ name: DEMO_CATCHMENT.name }).first('id');
const baseline = await scope.from('scenarios').where({ catchment_id: catchment.id, is_baseline: true }).first('id');
const briefing = await scope.from('briefings').where({ title: DEMO_BRIEFING.title }).first('id');
const study = await scope.from('studies').where({ name: DEMO_STUDY.name }).first('id');
const consultant = await scope.from('users').where({ role: 'consultant' }).first('id');

/** A finished run of a demo scenario: the stored one with the same inputs, or one simulated now. */
async function demoRun(scenarioName: string, options: Omit<StartRun, 'scenarioId'> = {}): Promise<number> {
  const scenario = await scope.from('scenarios').where({ catchment_id: catchment.id, name: scenarioName }).first('id');
  const request = startRunSchema.parse({ scenarioId: scenario.id, ...options });
  const { run } = await ctx.runs.start(scope, catchment.id, request, consultant.id);
  if (run.status === 'done') return run.id;
  const finished = await withWorkerProcess(ctx.queues, () => ctx.runs.finished(scope, catchment.id, run.id, RUN_WAIT_MS));
  if (finished.status !== 'done') throw new Error(`Run #${run.id} of "${scenarioName}" is ${finished.status}: ${finished.errorMessage ?? 'not finished in time'}`);
  return run.id;
}

const demoRunId = await demoRun(DEMO_VARIANT_SCENARIO);
const comparedRunId = await demoRun(COMPARED_SCENARIO);
const transientRunId = await demoRun(DEMO_VARIANT_SCENARIO, { transient: TRANSIENT });

type Role = 'admin' | 'consultant' | 'client';
const PAGES: { name: string; role: Role | null; path: string; ready: string }[] = [
  { name: 'sign-in', role: null, path: '/sign-in', ready: '[data-test=email]' },
  { name: 'overview', role: 'admin', path: '/', ready: '[data-test=main-nav]' },
  { name: 'catchments', role: 'admin', path: '/catchments', ready: '[data-test=catchment-table] tbody tr' },
  { name: 'catchment (bands)', role: 'admin', path: `/catchments/${catchment.id}?tab=bands`, ready: '[data-test=hypsometry-chart] canvas' },
  { name: 'scenario builder', role: 'admin', path: `/catchments/${catchment.id}/scenarios/${baseline.id}`, ready: '[data-test=scenario-form]' },
  { name: 'results', role: 'admin', path: `/catchments/${catchment.id}/results?runs=${demoRunId}`, ready: '[data-test=chart-bands] canvas' },
  { name: 'compared runs', role: 'admin', path: `/catchments/${catchment.id}/results?runs=${demoRunId},${comparedRunId}`, ready: '[data-test=chart-bands] canvas' },
  { name: 'multi-decade results', role: 'admin', path: `/catchments/${catchment.id}/runs/${transientRunId}/years`, ready: '[data-test=chart-glacier] canvas' },
  { name: 'lab', role: 'admin', path: `/lab?catchment=${catchment.id}`, ready: '[data-test=ostrem-chart] canvas' },
  { name: 'regional study', role: 'admin', path: `/studies/${study.id}`, ready: '[data-test=study-chart-catchments] canvas' },
  { name: 'briefing (client)', role: 'client', path: `/briefings/${briefing.id}`, ready: '[data-test=briefing-chart-0] canvas' },
  { name: 'briefing draft', role: 'consultant', path: `/briefings/${briefing.id}/edit`, ready: '[data-test=tab-draft]' },
];

interface Transfer { firstPaintJs: number; js: number; total: number; requests: number; files: { type: string; url: string; size: number }[] }

/** Sums what the network delivered (compressed bytes on the wire) while `page` loads `url` from an empty cache. */
async function coldLoad(page: Page, url: string, ready: string): Promise<Transfer> {
  const cdp = await page.context().newCDPSession(page);
  await cdp.send('Network.enable');
  await cdp.send('Network.clearBrowserCache');
  const responses = new Map<string, { type: string; url: string }>();
  const sizes = new Map<string, number>();
  cdp.on('Network.responseReceived', (e) => responses.set(e.requestId, { type: e.type, url: e.response.url }));
  cdp.on('Network.loadingFinished', (e) => sizes.set(e.requestId, e.encodedDataLength));
  await page.goto(url);
  await page.waitForSelector('h1', { timeout: 60_000 });
  await page.waitForSelector(ready, { timeout: 120_000 });
  await page.waitForLoadState('networkidle');
  // When the heading was drawn and when each script had arrived, both on the page's own clock.
  const timing = await page.evaluate(() => ({
    headingAt: (window as { __headingAt?: number }).__headingAt ?? Infinity,
    arrived: Object.fromEntries(performance.getEntriesByType('resource').map((e) => [(e as PerformanceResourceTiming).name, (e as PerformanceResourceTiming).responseEnd])),
  }));
  const files = [...sizes].map(([id, size]) => {
    const response = responses.get(id);
    return { type: response?.type ?? 'Other', url: response ? new URL(response.url).pathname : '?', size };
  }).sort((a, b) => b.size - a.size);
  await cdp.detach();
  const sum = (list: typeof files) => list.reduce((s, x) => s + x.size, 0);
  const scripts = files.filter((f) => f.type === 'Script');
  const firstPaintJs = sum(scripts.filter((f) => (timing.arrived[new URL(f.url, url).href] ?? Infinity) <= timing.headingAt));
  return { firstPaintJs, js: sum(scripts), total: sum(files), requests: files.length, files };
}

const kB = (bytes: number) => (bytes / 1024).toFixed(1);
const browser = await launchBrowser();
const rows: string[][] = [];
try {
  for (const p of PAGES) {
    const page = await browser.newPage();
    if (p.role) {
      const account = DEMO_ACCOUNTS.find((a) => a.role === p.role)!;
      await page.goto(`${base}/sign-in`);
      await page.fill('[data-test=email]', account.email);
      await page.fill('[data-test=password]', account.password);
      await page.click('[data-test=sign-in]');
      await page.waitForSelector('[data-test=main-nav]');
      await page.goto('about:blank');
    }
    // Notes the moment the page's heading is first in the document.
    await page.addInitScript(() => {
      new MutationObserver((_, observer) => {
        if (!document.querySelector('h1')) return;
        (window as { __headingAt?: number }).__headingAt = performance.now();
        observer.disconnect();
      }).observe(document, { childList: true, subtree: true });
    });
    const t = await coldLoad(page, `${base}${p.path}`, p.ready);
    rows.push([p.name, kB(t.firstPaintJs), kB(t.js), kB(t.total), String(t.requests)]);
    if (detail) {
      console.log(`${p.name}: ${kB(t.total)} kB in ${t.requests} requests, ${kB(t.js)} kB of them JS`);
      for (const f of t.files) console.log(`  ${kB(f.size).padStart(6)}  ${f.type.padEnd(10)} ${f.url}`);
    }
    await page.close();
  }
} finally {
  await browser.close();
  server.close();
  await ctx.close();
  await db.destroy();
}

console.log('Cold load (empty cache) of each page, signed in; kB = 1,024 bytes as transferred (compressed, headers included).');
console.log('Chart pages are loaded until their first chart is drawn; the target is under 250 kB of JS in all.\n');
const header = ['page', 'JS at first paint, kB', 'JS in all, kB', 'total transferred, kB', 'requests'];
const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i].length)));
const line = (cells: string[]) => cells.map((c, i) => (i === 0 ? c.padEnd(widths[i]) : c.padStart(widths[i]))).join(' | ');
console.log(line(header));
console.log(widths.map((w) => '-'.repeat(w)).join('-|-'));
for (const r of rows) console.log(line(r));
