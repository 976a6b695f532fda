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
    expect(await page.textContent('[data-test=study-chart-catchments]')).toMatch(/Upper Sarvel glacier catchment/);
  }, 300_000);

  it('lets the client read the regional result in a published briefing', async () => {
    const consultant = await signedInAgent(b.t.app, account('consultant').email, account('consultant').password);
    const study = (await consultant.get(`/api/studies/${studyId}`)).body.study;
    const first = study.catchments[0];
    const created = await consultant.post('/api/briefings').send({ catchmentId: first.catchmentId, title: `Dhenar valley ${Date.now()}`, selection: { runIds: [first.cells[0].runId] } });
    const id = created.body.briefing.id as number;
    await consultant.put(`/api/briefings/${id}/draft`).send({
      title: created.body.briefing.title, summary: 'Added runoff of the five glacier catchments of the Dhenar valley.', selection: { runIds: [first.cells[0].runId] },
      sections: [
        { kind: 'regional', heading: 'Added runoff by catchment', studyId, contentKey: 'regional-by-catchment' },
        { kind: 'regional', heading: 'The region, catchment by catchment', studyId, contentKey: 'regional-table' },
      ],
    });
    await consultant.post(`/api/briefings/${id}/publish`);
    await consultant.post(`/api/briefings/${id}/shares`).send({ emails: [account('client').email] });

    const page = await b.newPage();
    await signInThroughForm(page, b.baseUrl, account('client').email, account('client').password);
    await page.goto(`${b.baseUrl}/briefings/${id}`);
    await page.waitForSelector('text=Region (sum of the catchments)');
    await settled(page);
    await page.screenshot({ path: 'test-results/study-briefing-client.png', fullPage: true });
    expect(await page.textContent('body')).toMatch(/not routed/);
  });

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
