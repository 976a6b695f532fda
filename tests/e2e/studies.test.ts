import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seed as seedOrganisation } from '../../seeds/01_demo_organisation';
import { seed as seedCatchment } from '../../seeds/02_demo_catchment';
import { seed as seedSubscription } from '../../seeds/02_demo_subscription';
import { seed as seedRegion } from '../../seeds/06_demo_region';
import { DEMO_ACCOUNTS } from '../../seeds/data/demo-accounts';
import { DEMO_STUDY } from '../../seeds/data/demo-region';
import { openBrowser, settled, signInThroughForm, type BrowserSession } from '../support/browser';
import { signedInAgent } from '../support/factories';

let b: BrowserSession;
let studyId: number;
const account = (role: string) => DEMO_ACCOUNTS.find((a) => a.role === role)!;

beforeAll(async () => {
  b = await openBrowser();
  await seedOrganisation(b.t.db);
  await seedCatchment(b.t.db);
  await seedSubscription(b.t.db);
  // The demo region: four more sub-catchments and the started demo study, run by the tests' worker process.
  await seedRegion(b.t.db);
  studyId = (await b.t.db('studies').where({ name: DEMO_STUDY.name }).first('id')).id;
});
afterAll(async () => {
  await b?.close();
});

describe('regional studies in the browser', () => {
  it('shows the consultant the demo study catchment by catchment, then the regional totals with their charts', async () => {
    const page = await b.newPage();
    await signInThroughForm(page, b.baseUrl, account('consultant').email, account('consultant').password);
    await page.click('text=Regional studies');
    await page.waitForSelector(`[data-test=study-${studyId}]`);
    await page.click(`[data-test=study-${studyId}]`);
    await page.waitForSelector('[data-test=study-catchments-table]');
    await settled(page);
    await page.screenshot({ path: 'test-results/study-progress.png', fullPage: true });
    // Five catchments; the page follows them until every run is done.
    expect(await page.locator('[data-test=study-catchments-table] tbody tr').count()).toBe(5);
    await page.waitForSelector('[data-test=study-status]:has-text("Done")', { timeout: 240_000 });
    await page.waitForSelector('[data-test=study-total-volume]');
    await page.waitForSelector('[data-test=study-chart-catchments] canvas');
    await settled(page);
    expect(await page.textContent('[data-test=study-total-volume]')).toMatch(/million m³/);
    expect(await page.textContent('[data-test=cautions]')).toMatch(/not routed/);
    await page.screenshot({ path: 'test-results/study-results.png', fullPage: true });
    // The chart's numbers as a table.
    await page.click('[data-test=study-chart-catchments-view] >> text=Table');
    // The table view loads on demand.
    await page.waitForSelector('[data-test=study-chart-catchments] table >> text=Upper Sarvel glacier catchment');
  }, 300_000);

  it('lets the consultant put the regional result in a briefing in the editor, publish it, and the client read it', async () => {
    const consultant = await signedInAgent(b.t.app, account('consultant').email, account('consultant').password);
    const study = (await consultant.get(`/api/studies/${studyId}`)).body.study;
    const first = study.catchments[0];
    const title = `Dhenar valley ${Date.now()}`;
    // The draft is made for one of the study's runs (the create dialog has its own test); its sections are made in the editor.
    const created = await consultant.post('/api/briefings').send({ catchmentId: first.catchmentId, title, selection: { runIds: [first.cells[0].runId] } });
    const id = created.body.briefing.id as number;

    const page = await b.newPage();
    await signInThroughForm(page, b.baseUrl, account('consultant').email, account('consultant').password);
    await page.goto(`${b.baseUrl}/briefings/${id}/edit`);
    await page.waitForSelector('[data-test=briefing-title-input]');
    const sectionCount = () => page.$$eval('[data-test]', (els) => els.filter((e) => /^section-\d+$/.test(e.getAttribute('data-test')!)).length);
    const addRegional = async (heading: string, content: string | null) => {
      await page.click('[data-test=add-regional]');
      const i = (await sectionCount()) - 1;
      await page.fill(`[data-test=section-${i}-heading]`, heading);
      await page.click(`[data-test=section-${i}-study]`);
      await page.click(`.q-menu .q-item:has-text("${DEMO_STUDY.name}")`);
      if (content) {
        await page.click(`[data-test=section-${i}-content]`);
        await page.click(`.q-menu .q-item:has-text("${content}")`);
      }
    };
    await page.fill('[data-test=briefing-summary-input]', 'Added runoff of the five glacier catchments of the Dhenar valley.');
    await addRegional('Added runoff by catchment', null);
    await addRegional('The region, catchment by catchment', 'by catchment and for the region (table)');
    await page.click('[data-test=save-draft]');
    await page.waitForSelector('text=Draft saved.');
    await settled(page);
    await page.screenshot({ path: 'test-results/study-briefing-editor.png', fullPage: true });
    await page.click('[data-test=tab-sharing]');
    await page.fill('[data-test=share-emails]', account('client').email);
    await page.click('[data-test=share-submit]');
    await page.waitForSelector(`[data-test=shared-with] :text("${account('client').email}")`);
    await page.click('[data-test=tab-draft]');
    await page.click('[data-test=publish]');
    // Publishing asks first, naming the client it is shared with.
    await page.waitForSelector('[data-test=publish-dialog]');
    expect(await page.textContent('[data-test=publish-shared-with]')).toContain(account('client').email);
    await page.click('[data-test=publish-confirm]');
    await page.waitForSelector('[data-test=briefing-version]:has-text("Version 1")');
    await page.close();

    const reader = await b.newPage();
    await signInThroughForm(reader, b.baseUrl, account('client').email, account('client').password);
    await reader.click('[data-test=nav-briefings]');
    await reader.click(`[data-test=briefing-list] .q-item:has-text("${title}")`);
    await reader.waitForSelector('text=Region (sum of the catchments)');
    await reader.waitForSelector('canvas');
    await settled(reader);
    await reader.screenshot({ path: 'test-results/study-briefing-client.png', fullPage: true });
    const body = await reader.textContent('body');
    expect(body).toContain('Added runoff by catchment');
    expect(body).toContain('The region, catchment by catchment');
    expect(body).toMatch(/not routed/);
    await reader.close();
  });

  it('lets the consultant make a multi-decade study in the dialog, run it, and read the region year by year', async () => {
    const page = await b.newPage();
    await signInThroughForm(page, b.baseUrl, account('consultant').email, account('consultant').password);
    await page.goto(`${b.baseUrl}/studies`);
    await page.click('[data-test=new-study]');
    const name = `Dhenar decades ${Date.now()}`;
    await page.fill('[data-test=study-name]', name);
    await page.click('[data-test=study-catchments]');
    for (const catchment of ['Tashgar glacier catchment', 'Munel cirques']) await page.click(`.q-menu .q-item:has-text("${catchment}")`);
    await page.keyboard.press('Escape');
    await page.locator('[data-test=study-mode] >> text=Multi-decade').click();
    await page.fill('[data-test=transient-from]', '2030');
    await page.fill('[data-test=transient-years]', '8');
    await page.click('[data-test=study-create-submit]');
    // Too few years for peak water: said on the field, nothing made.
    await page.waitForSelector('[data-test=study-create] >> text=must be at least 11 years');
    await page.fill('[data-test=transient-years]', '12');
    await page.fill('[data-test=transient-target]', '2060');
    await page.click('[data-test=study-create-submit]');
    await page.waitForSelector('[data-test=study-start]');
    expect(await page.textContent('.q-page')).toMatch(/multi-decade: 12 years from 2030, 3 °C by 2060/);
    await page.click('[data-test=study-start]');
    await page.waitForSelector('[data-test=study-status]:has-text("Done")', { timeout: 240_000 });
    await page.waitForSelector('[data-test=study-chart-periods] canvas');
    expect(await page.textContent('[data-test=study-results]')).toMatch(/Added runoff of the region by year/);
    await page.click('[data-test=study-chart-periods-view] >> text=Table');
    await page.waitForSelector('[data-test=study-chart-periods] table >> text=2041');
    await settled(page);
    await page.screenshot({ path: 'test-results/study-multi-decade.png', fullPage: true });
    await page.close();
  }, 300_000);

  it('shows the admin the job queue of the organisation', async () => {
    const page = await b.newPage();
    await signInThroughForm(page, b.baseUrl, account('admin').email, account('admin').password);
    await page.click('text=Job queue');
    await page.waitForSelector('[data-test=queue-counts]');
    await page.waitForSelector('[data-test=queue-workers]');
    await settled(page);
    expect(await page.textContent('[data-test=queue-counts]')).toMatch(/Run simulations/);
    await page.screenshot({ path: 'test-results/queue-page.png', fullPage: true });
  });
});
