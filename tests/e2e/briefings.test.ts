import { readFileSync, writeFileSync } from 'node:fs';
import { PDFParse } from 'pdf-parse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Run } from '../../shared/schemas/runs';
import { CAUTIONS } from '../../shared/text/cautions';
import { seed as seedOrganisation } from '../../seeds/01_demo_organisation';
import { seed as seedCatchment } from '../../seeds/02_demo_catchment';
import { DEMO_ACCOUNTS, DEMO_ORGANISATION } from '../../seeds/data/demo-accounts';
import { DEMO_CATCHMENT } from '../../seeds/data/demo-catchment';
import { openBrowser, signInThroughForm, type BrowserSession } from '../support/browser';
import { signedInAgent, unique } from '../support/factories';
import { giveActivePlan, waitForRun } from '../support/runs';

let b: BrowserSession;
const consultant = DEMO_ACCOUNTS.find((a) => a.role === 'consultant')!;
const client = DEMO_ACCOUNTS.find((a) => a.role === 'client')!;
// One melt season keeps the demo run short.
const SEASON = { from: '2022-05-01', to: '2022-09-30' };
const VARIANT = 'Soot on snow and ice';
/** The finished run's id and scenario name (a reused identical run keeps the name it was first run under). */
let run: Run;

beforeAll(async () => {
  b = await openBrowser();
  await seedOrganisation(b.t.db);
  await seedCatchment(b.t.db);
  const organisation = await b.t.db('organisations').where({ name: DEMO_ORGANISATION.name }).first('id');
  if (!(await b.t.db('subscriptions').where({ organisation_id: organisation.id, status: 'active' }).first('id'))) await giveActivePlan(b.t.db, organisation.id);
  // A finished variant run of the demo catchment, started through the API as the consultant would.
  const agent = await signedInAgent(b.t.app, consultant.email, consultant.password);
  const catchment = await b.t.db('catchments').where({ organisation_id: organisation.id, name: DEMO_CATCHMENT.name }).first('id');
  const scenarios = (await agent.get(`/api/catchments/${catchment.id}/scenarios`)).body.scenarios;
  await agent.patch(`/api/catchments/${catchment.id}/scenarios/${scenarios[0].id}`).send({ changes: { period: SEASON } });
  // Found or made, so the file can run again on the same database (an identical run is then reused).
  const scenarioId = scenarios.find((s: { name: string }) => s.name === VARIANT)?.id
    ?? (await agent.post(`/api/catchments/${catchment.id}/scenarios`).send({ name: VARIANT, changes: { period: SEASON, blackCarbonSnowNgG: 300, blackCarbonIceNgG: 1000 } })).body.scenario.id;
  const started = await agent.post(`/api/catchments/${catchment.id}/runs`).send({ scenarioId });
  expect([200, 202]).toContain(started.status); // 200: an identical finished run is reused
  run = await waitForRun(agent, catchment.id, started.body.run.id, 120_000);
  expect(run.status).toBe('done');
});
afterAll(async () => {
  await b?.close();
});

describe('briefings in the browser', () => {
  const title = `Darker ice at Sarvel ${unique('')}`;

  it('lets a consultant assemble, share and publish a briefing for the demo catchment', async () => {
    const page = await b.newPage();
    await signInThroughForm(page, b.baseUrl, consultant.email, consultant.password);
    await page.click('[data-test=nav-briefings]');
    await page.click('[data-test=new-briefing]');
    await page.click('[data-test=briefing-catchment]');
    await page.click(`.q-menu .q-item:has-text("${DEMO_CATCHMENT.name}")`);
    await page.click('[data-test=briefing-runs]');
    await page.click(`.q-menu .q-item:has-text("run #${run.id},")`);
    await page.keyboard.press('Escape');
    await page.fill('[data-test=briefing-new-title]', title);
    await page.click('[data-test=briefing-create-submit]');

    await page.waitForSelector('[data-test=briefing-title-input]');
    await page.fill('[data-test=briefing-summary-input]', 'Soot on the snow and ice adds **summer** water.');
    await page.click('[data-test=add-chart]');
    await page.click('[data-test=add-table]');
    await page.click('[data-test=add-text]');
    await page.fill('[data-test=section-2-text]', 'Check the *July* peak against the gauge. <script>window.__hacked = true</script>');
    await page.click('[data-test=save-draft]');
    await page.waitForSelector('text=Draft saved.');
    await page.screenshot({ path: 'test-results/briefing-editor.png', fullPage: true });

    await page.click('[data-test=tab-sharing]');
    await page.fill('[data-test=share-emails]', client.email);
    await page.click('[data-test=share-submit]');
    await page.waitForSelector(`[data-test=shared-with] :text("${client.email}")`);

    await page.click('[data-test=tab-draft]');
    await page.click('[data-test=publish]');
    // Publishing asks first, names who it is shared with and offers to share with more in the same step.
    const dialog = await page.waitForSelector('[data-test=publish-dialog]');
    expect(await dialog.innerText()).toContain('Publish version 1?');
    expect(await page.textContent('[data-test=publish-shared-with]')).toContain(client.email);
    await page.screenshot({ path: 'test-results/briefing-publish-confirmation.png' });
    await page.click('[data-test=publish-confirm]');
    await page.waitForSelector('[data-test=briefing-version]:has-text("Version 1")');
    expect(await page.textContent('[data-test=briefing-title]')).toBe(title);
    await page.close();
  });

  it('lets the client open the shared briefing, read it and download the PDF', async () => {
    const page = await b.newPage();
    await signInThroughForm(page, b.baseUrl, client.email, client.password);
    await page.click('[data-test=nav-briefings]');
    await page.click(`[data-test=briefing-list] .q-item:has-text("${title}")`);
    await page.waitForSelector('[data-test=briefing-headlines]');
    await page.waitForSelector('[data-test=briefing-chart-0] canvas');
    expect(await page.textContent('[data-test=briefing-version]')).toContain('Version 1');
    expect(await page.locator('[data-test=headline-value]').count()).toBe(4);
    expect(await page.textContent('[data-test=cautions]')).toContain(CAUTIONS[0]);
    expect(await page.evaluate(() => (window as unknown as { __hacked?: boolean }).__hacked)).toBeUndefined();
    await page.screenshot({ path: 'test-results/briefing-client-reading.png', fullPage: true });

    const [download] = await Promise.all([page.waitForEvent('download'), page.click('[data-test=download-pdf]')]);
    const pdf = readFileSync((await download.path())!);
    writeFileSync('test-results/briefing-client.pdf', pdf);
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    const parser = new PDFParse({ data: new Uint8Array(pdf) });
    const text = (await parser.getText()).text.replace(/\s+/g, ' ');
    await parser.destroy();
    expect(text).toContain(title);
    expect(text).toContain(run.scenarioName);
    expect(text).toContain(CAUTIONS[3]);

    await page.fill('[data-test=comment-body]', 'Which gauge did you compare with?');
    await page.click('[data-test=comment-send]');
    await page.waitForSelector('[data-test=comment]:has-text("Which gauge did you compare with?")');
    // Clients have no way to edit: no draft link on their page.
    expect(await page.locator('text=Back to the draft').count()).toBe(0);
    await page.close();
  });

  it('shows the consultant the comment from the client and the activity log', async () => {
    const page = await b.newPage();
    await signInThroughForm(page, b.baseUrl, consultant.email, consultant.password);
    await page.click('[data-test=nav-briefings]');
    await page.click(`[data-test=briefing-list] .q-item:has-text("${title}")`);
    await page.click('[data-test=tab-comments]');
    await page.waitForSelector('[data-test=comment]:has-text("Which gauge did you compare with?")');
    await page.click('[data-test=tab-activity]');
    const log = page.locator('[data-test=briefing-audit]');
    await log.locator(`tr:has-text("${client.email}"):has-text("downloaded the PDF")`).waitFor();
    expect(await log.textContent()).toContain('published');
    await page.screenshot({ path: 'test-results/briefing-activity.png', fullPage: true });
    await page.click('[data-test=tab-preview]');
    await page.waitForSelector('[data-test=briefing-headlines]');
    await page.screenshot({ path: 'test-results/briefing-preview.png' });
    await page.close();
  });
});
