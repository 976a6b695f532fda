import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CAUTIONS } from '../../shared/text/cautions';
import { seed as seedOrganisation } from '../../seeds/01_demo_organisation';
import { seed as seedCatchment } from '../../seeds/02_demo_catchment';
import { seed as seedScenarios } from '../../seeds/03_demo_scenarios';
import { seed as seedBriefing } from '../../seeds/04_demo_briefing';
import { DEMO_ACCOUNTS, DEMO_ORGANISATION } from '../../seeds/data/demo-accounts';
import { DEMO_BRIEFING, DEMO_VARIANT_SCENARIO } from '../../seeds/data/demo-briefing';
import { DEMO_CATCHMENT } from '../../seeds/data/demo-catchment';
import { openBrowser, signInThroughForm, type BrowserSession } from '../support/browser';
import { signedInAgent } from '../support/factories';

// In the e2e project, whose files run one at a time: the other files there re-seed the same demo organisation.
let b: BrowserSession;
let organisationId: number;
let catchmentId: number;
const client = DEMO_ACCOUNTS.find((a) => a.role === 'client')!;

/** The demo seeds in the order `npm run seed` runs them (the subscription seed plays no part here). */
async function seedDemo(): Promise<void> {
  await seedOrganisation(b.t.db);
  await seedCatchment(b.t.db);
  await seedScenarios(b.t.db);
  await seedBriefing(b.t.db);
}

/** Published demo briefings shared with the demo client (other tests may share their own on the same database). */
async function sharedWithClient() {
  const user = await b.t.db('users').where({ email: client.email }).first('id');
  return b.t.db('briefings').join('briefing_shares', 'briefing_shares.briefing_id', 'briefings.id')
    .where({ 'briefings.organisation_id': organisationId, 'briefings.title': DEMO_BRIEFING.title, 'briefing_shares.user_id': user.id }).where('briefings.latest_version', '>', 0)
    .select('briefings.id', 'briefings.title', 'briefings.latest_version', 'briefings.selection');
}

const variantRuns = () => b.t.db('runs').where({ catchment_id: catchmentId, scenario_name: DEMO_VARIANT_SCENARIO }).count({ n: '*' }).first();

const binary = (res: request.Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};

beforeAll(async () => {
  b = await openBrowser();
  await seedDemo();
  organisationId = (await b.t.db('organisations').where({ name: DEMO_ORGANISATION.name }).first('id')).id;
  catchmentId = (await b.t.db('catchments').where({ organisation_id: organisationId, name: DEMO_CATCHMENT.name }).first('id')).id;
});
afterAll(async () => {
  await b?.close();
});

describe('demo briefing seed', () => {
  it('leaves exactly one published briefing shared with the demo client after seeding twice, with a finished run behind it', async () => {
    const runsBefore = await variantRuns();
    await seedDemo();
    expect(await variantRuns()).toEqual(runsBefore);

    const briefings = await sharedWithClient();
    expect(briefings).toHaveLength(1);
    expect(briefings[0]).toMatchObject({ latest_version: 1 });
    const selection = briefings[0].selection;
    const { runIds } = (typeof selection === 'string' ? JSON.parse(selection) : selection) as { runIds: number[] };
    expect(runIds).toHaveLength(1);
    const run = await b.t.db('runs').where({ id: runIds[0] }).first();
    expect(run).toMatchObject({ catchment_id: catchmentId, scenario_name: DEMO_VARIANT_SCENARIO, status: 'done' });
    expect(run.baseline_changes).not.toBeNull();
    const kinds = (await b.t.db('run_members').where({ run_id: run.id }).select('kind')).map((m) => m.kind).sort();
    expect(kinds).toEqual(['baseline', 'scenario']);
  });

  it('shows the demo client the briefing in the browser', async () => {
    const page = await b.newPage();
    await signInThroughForm(page, b.baseUrl, client.email, client.password);
    await page.click('[data-test=nav-briefings]');
    await page.click(`[data-test=briefing-list] .q-item:has-text("${DEMO_BRIEFING.title}")`);
    await page.waitForSelector('[data-test=briefing-chart-0] canvas');
    expect(await page.textContent('[data-test=briefing-title]')).toBe(DEMO_BRIEFING.title);
    expect(await page.textContent('[data-test=cautions]')).toContain(CAUTIONS[0]);
    await page.screenshot({ path: 'test-results/demo-briefing-client.png', fullPage: true });
    await page.close();
  });

  it('lets the demo client read the briefing and download its PDF and CSV', async () => {
    const agent = await signedInAgent(b.t.app, client.email, client.password);
    const list = await agent.get('/api/briefings');
    expect(list.status).toBe(200);
    const item = list.body.briefings.find((b: { title: string }) => b.title === DEMO_BRIEFING.title);
    expect(item).toMatchObject({ catchmentName: DEMO_CATCHMENT.name, latestVersion: 1 });

    const reading = await agent.get(`/api/briefings/${item.id}/versions/latest`);
    expect(reading.status).toBe(200);
    expect(reading.body.snapshot.sections.map((s: { kind: string }) => s.kind)).toEqual(['chart', 'table', 'text']);
    expect(reading.body.snapshot.headlines.length).toBeGreaterThan(0);

    const pdf = await agent.get(`/api/briefings/${item.id}/versions/latest/pdf`).buffer(true).parse(binary);
    expect(pdf.status).toBe(200);
    expect((pdf.body as Buffer).subarray(0, 5).toString()).toBe('%PDF-');
    const csv = await agent.get(`/api/briefings/${item.id}/versions/latest/csv`);
    expect(csv.status).toBe(200);
    expect(csv.text).toContain(CAUTIONS[0]);
  });
});
