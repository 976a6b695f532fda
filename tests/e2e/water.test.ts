import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seed as seedOrganisation } from '../../seeds/01_demo_organisation';
import { seed as seedCatchment } from '../../seeds/02_demo_catchment';
import { seed as seedSubscription } from '../../seeds/02_demo_subscription';
import { seed as seedScenarios } from '../../seeds/03_demo_scenarios';
import { DEMO_ACCOUNTS } from '../../seeds/data/demo-accounts';
import { DEMO_CATCHMENT } from '../../seeds/data/demo-catchment';
import { openBrowser, settled, signInThroughForm, type BrowserSession } from '../support/browser';
import { unique } from '../support/factories';

let b: BrowserSession;
let catchmentId: number;
const consultant = DEMO_ACCOUNTS.find((a) => a.role === 'consultant')!;

beforeAll(async () => {
  b = await openBrowser();
  await seedOrganisation(b.t.db);
  await seedCatchment(b.t.db);
  await seedSubscription(b.t.db);
  await seedScenarios(b.t.db);
  catchmentId = (await b.t.db('catchments').where({ name: DEMO_CATCHMENT.name }).orderBy('id', 'desc').first('id')).id;
  await b.t.db('lab_jobs').where('catchment_id', catchmentId).delete();
  await b.t.db('water_balance_closures').where('catchment_id', catchmentId).delete();
});
afterAll(() => b?.close());

describe('where the water comes from, in the browser', () => {
  it('lets a consultant add a station, see the fitted gradients and set a month by hand', async () => {
    const page = await b.newPage();
    await signInThroughForm(page, b.baseUrl, consultant.email, consultant.password);
    await page.goto(`${b.baseUrl}/catchments/${catchmentId}?tab=stations`);
    await page.waitForSelector('[data-test=station-table] >> text=Tsaro col station');
    const name = unique('Ridge mast ');
    await page.click('[data-test=add-station]');
    await page.fill('[data-test=station-name]', name);
    await page.fill('[data-test=station-network]', 'An invented avalanche service');
    await page.fill('[data-test=station-elevation]', '9000');
    await page.click('[data-test=station-save]');
    // A station above the catchment's top is refused on its field, and nothing is stored.
    await page.waitForSelector('[data-test=station-dialog] >> text=lies above the catchment\'s highest band');
    await page.fill('[data-test=station-elevation]', '4710');
    await page.click('[data-test=station-add-accuracy]');
    await page.fill('[data-test=station-accuracy-0]', '±0.5 °C (invented)');
    await page.click('[data-test=station-save]');
    await page.waitForSelector(`[data-test=station-table] >> text=${name}`);

    await page.goto(`${b.baseUrl}/catchments/${catchmentId}?tab=gradients`);
    await page.waitForSelector('[data-test=chart-lapse-rate] canvas');
    await page.waitForSelector('[data-test=chart-precipitation-profile] canvas');
    expect(await page.textContent('[data-test=gradient-month-6]')).toMatch(/per km ± [\d.]+, r² [\d.]+, 4 stations.*Fitted/);
    await page.fill('[data-test=override-lapse-6]', '-5.6');
    await page.click('[data-test=gradients-use]');
    await page.waitForFunction(() => /Set by hand/.test(document.querySelector('[data-test=gradient-month-6]')?.textContent ?? ''));
    await page.click('[data-test=gradients-save]');
    await page.waitForSelector('text=Gradients saved: runs now take band climate from them.');
    await settled(page);
    await page.screenshot({ path: 'test-results/water-gradients.png', fullPage: true });
    await page.close();
  });

  it('closes the water balance in the lab, keeps it, and runs the baseline on it', async () => {
    const page = await b.newPage();
    await signInThroughForm(page, b.baseUrl, consultant.email, consultant.password);
    await page.goto(`${b.baseUrl}/lab?catchment=${catchmentId}`);
    await page.click('[data-test=lab-tab-water-balance]');
    await page.click('[data-test=balance-start]');
    await page.waitForSelector('[data-test=balance-result]', { timeout: 180_000 });
    expect(await page.textContent('[data-test=balance-outcome]')).toMatch(/The water balance closes with Precipitation factor [\d.]+ ± [\d.]+/);
    expect(Number((await page.textContent('[data-test=balance-ratio]'))!.split('×')[0])).toBeGreaterThan(1.2);
    await page.waitForSelector('[data-test=chart-balance-elevation] canvas');
    await page.click('[data-test=balance-keep]');
    await page.waitForSelector('[data-test=balance-kept] >> text=In force');
    await settled(page);
    await page.screenshot({ path: 'test-results/water-balance.png', fullPage: true });

    await page.goto(`${b.baseUrl}/catchments/${catchmentId}?tab=runs`);
    await page.locator('[data-test=scenario-Baseline] .q-btn').first().click();
    await page.click('[data-test=precipitation-source]');
    await page.locator('.q-menu .q-item >> text=The water-balance precipitation').click();
    await page.click('[data-test=save-scenario]');
    await page.waitForURL(/tab=runs/);
    await page.close();
  }, 240_000);

  it('switches redistribution and routing on and runs a multi-decade darkening scenario that shows the glacier shrinking and peak water', async () => {
    const page = await b.newPage();
    await signInThroughForm(page, b.baseUrl, consultant.email, consultant.password);
    await page.goto(`${b.baseUrl}/catchments/${catchmentId}?tab=water`);
    await page.click('[data-test=water-avalanche]');
    await page.click('[data-test=water-routing]');
    await page.click('[data-test=water-save]');
    await page.waitForSelector('text=Saved: new runs take these settings.');

    await page.goto(`${b.baseUrl}/catchments/${catchmentId}?tab=runs`);
    await page.click('[data-test="run-Black carbon, moderate"]');
    await page.locator('[data-test=run-mode] >> text=Multi-decade').click();
    await page.fill('[data-test=transient-years]', '5');
    await page.click('[data-test=start-run]');
    await page.waitForSelector('[data-test=run-dialog] >> text=must be at least 11 years');
    await page.fill('[data-test=transient-years]', '15');
    await page.fill('[data-test=transient-from]', '2030');
    await page.fill('[data-test=transient-target]', '2060');
    const [started] = await Promise.all([
      page.waitForResponse((r) => r.request().method() === 'POST' && /\/runs$/.test(r.url()), { timeout: 60_000 }),
      page.click('[data-test=start-run]'),
    ]);
    expect(started.status()).toBe(202);
    const { run } = await started.json() as { run: { id: number } };
    await page.waitForSelector(`[data-test=run-status-${run.id}] >> text=done`, { timeout: 180_000 });
    expect(await page.textContent('[data-test=runs-table]')).toMatch(/15 years from 2030, 3 °C by 2060/);
    await page.click(`[data-test=results-${run.id}]`);
    await page.waitForSelector('[data-test=transient-results]');
    await page.waitForSelector('[data-test=chart-peak-water] canvas');
    const findings = await page.textContent('[data-test=transient-findings]');
    expect(findings).toMatch(/Glacier area 46\.7 km² in 2030, [\d.]+ km² in 2044 in the baseline, [\d.]+ km² with Black carbon, moderate\./);
    expect(findings).toMatch(/Peak water \(largest 11-year mean of glacier runoff\): baseline /);
    expect(await page.textContent('[data-test=transient-set-up]')).toMatch(/The water-balance precipitation closed against the measured runoff/);
    await settled(page);
    await page.screenshot({ path: 'test-results/water-multi-decade.png', fullPage: true });
    await page.close();
  }, 300_000);
});
