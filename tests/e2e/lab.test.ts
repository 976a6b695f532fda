import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seed as seedOrganisation } from '../../seeds/01_demo_organisation';
import { seed as seedCatchment } from '../../seeds/02_demo_catchment';
import { seed as seedSubscription } from '../../seeds/02_demo_subscription';
import { DEMO_ACCOUNTS } from '../../seeds/data/demo-accounts';
import { DEMO_CATCHMENT } from '../../seeds/data/demo-catchment';
import { openBrowser, signInThroughForm, type BrowserSession } from '../support/browser';

let b: BrowserSession;
let catchmentId: number;
const scientist = DEMO_ACCOUNTS.find((a) => a.role === 'scientist')!;
const client = DEMO_ACCOUNTS.find((a) => a.role === 'client')!;

beforeAll(async () => {
  b = await openBrowser();
  await seedOrganisation(b.t.db);
  await seedCatchment(b.t.db);
  await seedSubscription(b.t.db);
  catchmentId = (await b.t.db('catchments').where({ name: DEMO_CATCHMENT.name }).orderBy('id', 'desc').first('id')).id;
  // The demo catchment is re-used by every run of the seeds: start from no lab history.
  await b.t.db('lab_jobs').where('catchment_id', catchmentId).delete();
  await b.t.db('calibrated_parameters').where('catchment_id', catchmentId).delete();
});
afterAll(() => b?.close());

describe('the lab in the browser', () => {
  it('shows a scientist the Østrem curve and the calibration chart for the demo catchment', async () => {
    const page = await b.newPage();
    await signInThroughForm(page, b.baseUrl, scientist.email, scientist.password);
    await page.goto(`${b.baseUrl}/lab?catchment=${catchmentId}`);
    await page.waitForSelector('[data-test=ostrem-chart] canvas', { timeout: 60_000 });
    await page.waitForSelector('[data-test=impurity-chart] canvas');
    const summary = await page.textContent('[data-test=lab-surface] p');
    expect(summary).toMatch(/critical thickness of [\d.]+ cm/);
    await page.screenshot({ path: 'test-results/lab-surface.png', fullPage: true });

    await page.click('[data-test=ostrem-chart-view] >> text=Table');
    // The table view loads on demand: wait for its rows before counting them.
    await page.waitForSelector('[data-test=ostrem-chart] tbody tr', { state: 'attached' });
    expect(await page.locator('[data-test=ostrem-chart] tbody tr').count()).toBeGreaterThan(10);

    await page.click('[data-test=lab-tab-calibration]');
    await page.waitForSelector('[data-test=calibration-chart] canvas', { timeout: 60_000 });
    const scores = await page.textContent('[data-test=scores-table]');
    expect(scores).toMatch(/Daily/);
    expect(scores).toMatch(/Monthly means/);
    await page.screenshot({ path: 'test-results/lab-calibration.png', fullPage: true });

    await page.waitForSelector('[data-test=stake-balance-chart] canvas');

    await page.fill('[data-test=param-lapseRateCPerKm]', '-5.5');
    await page.click('[data-test=save-calibration]');
    await page.waitForSelector('[data-test=calibration-saved]');
    expect(await page.textContent('[data-test=calibration-saved]')).toMatch(/saved by .* \(daily KGE -?[\d.]+/i);
    await page.close();
  });

  it('runs a sweep and an automatic calibration as jobs, and compares reference models', async () => {
    const page = await b.newPage();
    await signInThroughForm(page, b.baseUrl, scientist.email, scientist.password);
    await page.goto(`${b.baseUrl}/lab?catchment=${catchmentId}`);
    await page.waitForSelector('[data-test=ostrem-chart] canvas', { timeout: 60_000 });
    await page.click('[data-test=lab-tabs] >> text=Sweeps');
    await page.click('text=Second parameter');
    await page.click('[data-test=sweep-run]');
    await page.waitForSelector('[data-test=sweep-chart] canvas', { timeout: 60_000 });
    await page.screenshot({ path: 'test-results/lab-sweep.png', fullPage: true });

    await page.click('[data-test=lab-tabs] >> text=Reference models');
    await page.waitForSelector('[data-test=reference-chart] canvas', { timeout: 60_000 });
    expect(await page.locator('[data-test=lab-reference] tbody tr').count()).toBe(3);
    await page.screenshot({ path: 'test-results/lab-reference.png', fullPage: true });

    await page.click('[data-test=lab-tab-calibration]');
    await page.waitForSelector('[data-test=calibration-chart] canvas', { timeout: 60_000 });
    await page.locator('[data-test=auto-calibration] input[type=number]').fill('15');
    await page.click('[data-test=auto-start]');
    await page.waitForSelector('[data-test=auto-result]', { timeout: 180_000 });
    expect(await page.textContent('[data-test=auto-scores]')).toMatch(/Calibration period, after/);
    await page.screenshot({ path: 'test-results/lab-auto-calibration.png', fullPage: true });

    await page.click('[data-test=auto-target]');
    await page.click('.q-menu .q-item:has-text("Stake balances")');
    await page.fill('[data-test=auto-from]', '2021-10-01');
    await page.fill('[data-test=auto-to]', '2022-09-30');
    await page.click('[data-test=auto-start]');
    await page.waitForSelector('[data-test=auto-scores]:has-text("Stake balances")', { timeout: 180_000 });
    await page.screenshot({ path: 'test-results/lab-auto-calibration-stakes.png', fullPage: true });
    await page.close();
  }, 420_000);

  it('keeps clients out of the lab', async () => {
    const page = await b.newPage();
    await signInThroughForm(page, b.baseUrl, client.email, client.password);
    expect(await page.locator('[data-test=nav-lab]').count()).toBe(0);
    await page.goto(`${b.baseUrl}/lab`);
    // The guard answers by sending the client back to the overview with a warning: wait for that answer, then look.
    await page.waitForSelector('text=Your role does not give access to that page.');
    expect(new URL(page.url()).pathname).toBe('/');
    expect(await page.locator('[data-test=lab-surface]').count()).toBe(0);
    await page.close();
  });
});
