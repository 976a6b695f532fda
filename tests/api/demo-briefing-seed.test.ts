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
import { signedInAgent } from '../support/factories';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let organisationId: number;
let catchmentId: number;
const client = DEMO_ACCOUNTS.find((a) => a.role === 'client')!;

/** The demo seeds in the order `npm run seed` runs them (the subscription seed plays no part here). */
async function seedDemo(): Promise<void> {
  await seedOrganisation(t.db);
  await seedCatchment(t.db);
  await seedScenarios(t.db);
  await seedBriefing(t.db);
}

/** Published demo briefings shared with the demo client (other tests may share their own on the same database). */
async function sharedWithClient() {
  const user = await t.db('users').where({ email: client.email }).first('id');
  return t.db('briefings').join('briefing_shares', 'briefing_shares.briefing_id', 'briefings.id')
    .where({ 'briefings.organisation_id': organisationId, 'briefings.title': DEMO_BRIEFING.title, 'briefing_shares.user_id': user.id }).where('briefings.latest_version', '>', 0)
    .select('briefings.id', 'briefings.title', 'briefings.latest_version', 'briefings.selection');
}

const variantRuns = () => t.db('runs').where({ catchment_id: catchmentId, scenario_name: DEMO_VARIANT_SCENARIO }).count({ n: '*' }).first();

const binary = (res: request.Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};

beforeAll(async () => {
  t = createTestApp();
  await seedDemo();
  organisationId = (await t.db('organisations').where({ name: DEMO_ORGANISATION.name }).first('id')).id;
  catchmentId = (await t.db('catchments').where({ organisation_id: organisationId, name: DEMO_CATCHMENT.name }).first('id')).id;
});
afterAll(async () => {
  await t?.ctx.pdfPool.close();
  await t?.close();
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
    const run = await t.db('runs').where({ id: runIds[0] }).first();
    expect(run).toMatchObject({ catchment_id: catchmentId, scenario_name: DEMO_VARIANT_SCENARIO, status: 'done' });
    expect(run.baseline_changes).not.toBeNull();
    const kinds = (await t.db('run_members').where({ run_id: run.id }).select('kind')).map((m) => m.kind).sort();
    expect(kinds).toEqual(['baseline', 'scenario']);
  });

  it('lets the demo client read the briefing and download its PDF and CSV', async () => {
    const agent = await signedInAgent(t.app, client.email, client.password);
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
