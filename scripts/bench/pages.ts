/**
 * npm run bench:pages — bytes a browser transfers on a cold load (empty cache) of each main page,
 * signed in as the demo admin (the client for the client's briefing): compressed JavaScript and
 * everything together, as the server sends them (gzip or brotli, as Chromium asks). The issue asks
 * for chart pages under 250 kB of compressed JavaScript.
 *
 * Serves the built client (run `npm run build` first) and the API in this process on a free port,
 * against the database in the environment (DB_* variables) holding the demo (`npm start` seeds it).
 */
import type { AddressInfo } from 'node:net';
import type { Page } from 'playwright-core';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/config';
import { createContext } from '../../server/context';
import { createDb } from '../../server/db';
import { createLogger } from '../../server/logger';
import { DEMO_ACCOUNTS, DEMO_ORGANISATION } from '../../seeds/data/demo-accounts';
import { DEMO_BRIEFING } from '../../seeds/data/demo-briefing';
import { DEMO_CATCHMENT } from '../../seeds/data/demo-catchment';
import { launchBrowser } from '../../tests/support/browser';

const config = loadConfig();
const logger = createLogger({ ...config.log, level: 'silent' });
const db = createDb(config.db, logger);
const ctx = createContext(config, db, { logger });
const server = createApp(ctx, { clientDir: 'dist' }).listen(0, '127.0.0.1');
await new Promise<void>((resolve) => server.once('listening', () => resolve()));
const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;

const organisation = await db('organisations').where({ name: DEMO_ORGANISATION.name }).first('id');
if (!organisation) throw new Error('The demo is missing from this database: run npm start (or npm run seed) first.');
const catchment = await db('catchments').where({ organisation_id: organisation.id, name: DEMO_CATCHMENT.name }).first('id');
const run = await db('runs').where({ catchment_id: catchment.id, status: 'done' }).orderBy('id', 'desc').first('id');
const baseline = await db('scenarios').where({ catchment_id: catchment.id, is_baseline: true }).first('id');
const briefing = await db('briefings').where({ organisation_id: organisation.id, title: DEMO_BRIEFING.title }).first('id');

const PAGES: { name: string; role: 'admin' | 'client' | null; path: string; ready: string }[] = [
  { name: 'sign-in', role: null, path: '/sign-in', ready: '[data-test=email]' },
  { name: 'overview', role: 'admin', path: '/', ready: 'h1' },
  { name: 'catchments', role: 'admin', path: '/catchments', ready: '[data-test=catchment-table] tbody tr' },
  { name: 'catchment (bands)', role: 'admin', path: `/catchments/${catchment.id}?tab=bands`, ready: '[data-test=hypsometry-chart] canvas' },
  { name: 'scenario builder', role: 'admin', path: `/catchments/${catchment.id}/scenarios/${baseline.id}`, ready: '[data-test=scenario-form]' },
  { name: 'results', role: 'admin', path: `/catchments/${catchment.id}/results?runs=${run?.id ?? ''}`, ready: '[data-test=chart-bands] canvas' },
  { name: 'lab', role: 'admin', path: '/lab', ready: 'h1' },
  { name: 'briefing (client)', role: 'client', path: `/briefings/${briefing.id}`, ready: '[data-test=briefing-title]' },
];

interface Transfer { js: number; total: number; requests: number }

/** Sums what the network delivered (compressed bytes on the wire) while `page` loads `url`. */
async function coldLoad(page: Page, url: string, ready: string): Promise<Transfer> {
  const cdp = await page.context().newCDPSession(page);
  await cdp.send('Network.enable');
  await cdp.send('Network.clearBrowserCache');
  const types = new Map<string, string>();
  const sizes = new Map<string, number>();
  cdp.on('Network.responseReceived', (e) => types.set(e.requestId, e.type));
  cdp.on('Network.loadingFinished', (e) => sizes.set(e.requestId, e.encodedDataLength));
  await page.goto(url);
  await page.waitForSelector(ready, { timeout: 60_000 });
  await page.waitForLoadState('networkidle');
  let js = 0;
  let total = 0;
  for (const [id, size] of sizes) {
    total += size;
    if (types.get(id) === 'Script') js += size;
  }
  await cdp.detach();
  return { js, total, requests: sizes.size };
}

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
    const t = await coldLoad(page, `${base}${p.path}`, p.ready);
    rows.push([p.name, (t.js / 1024).toFixed(1), (t.total / 1024).toFixed(1), String(t.requests)]);
    await page.close();
  }
} finally {
  await browser.close();
  server.close();
  await ctx.close();
  await db.destroy();
}

const header = ['page (cold load)', 'compressed JS, kB', 'total transferred, kB', 'requests'];
const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i].length)));
const line = (cells: string[]) => cells.map((c, i) => (i === 0 ? c.padEnd(widths[i]) : c.padStart(widths[i]))).join(' | ');
console.log(line(header));
console.log(widths.map((w) => '-'.repeat(w)).join('-|-'));
for (const r of rows) console.log(line(r));
