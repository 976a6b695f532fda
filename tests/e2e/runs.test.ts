import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seed as seedOrganisation } from '../../seeds/01_demo_organisation';
import { seed as seedCatchment } from '../../seeds/02_demo_catchment';
import { seed as seedSubscription } from '../../seeds/02_demo_subscription';
import { DEMO_ACCOUNTS } from '../../seeds/data/demo-accounts';
import { DEMO_CATCHMENT } from '../../seeds/data/demo-catchment';
import { openBrowser, signInThroughForm, type BrowserSession } from '../support/browser';
import { signedInAgent, unique } from '../support/factories';
import { waitForRun } from '../support/runs';

let b: BrowserSession;
/** A melt season inside the demo record, for a variant when the baseline sets none. */
const SEASON = { from: '2022-05-01', to: '2022-09-30' };
let catchmentId: number;
const consultant = DEMO_ACCOUNTS.find((a) => a.role === 'consultant')!;

beforeAll(async () => {
  b = await openBrowser();
  await seedOrganisation(b.t.db);
  await seedCatchment(b.t.db);
  await seedSubscription(b.t.db);
  catchmentId = (await b.t.db('catchments').where({ name: DEMO_CATCHMENT.name }).first('id')).id;
});
afterAll(async () => {
  await b?.close();
});

describe('darkening scenarios in the browser', () => {
  it('takes a consultant from the demo catchment to a black-carbon variant, its run, the added-melt chart and the totals', async () => {
    const page = await b.newPage();
    await signInThroughForm(page, b.baseUrl, consultant.email, consultant.password);
    await page.goto(`${b.baseUrl}/catchments/${catchmentId}?tab=runs`);
    await page.waitForSelector('[data-test=runs-panel] [data-test="scenario-Baseline"]');

    const name = unique('Soot ');
    await page.click('[data-test=new-scenario]');
    await page.waitForSelector('[data-test=scenario-form]');
    await page.fill('[data-test=scenario-name]', name);
    // A value of its own: an identical earlier run (same inputs) would be reused instead of run again.
    await page.fill('[data-test=bc-snow-value]', String(400 + (Date.now() % 300)));
    await page.fill('[data-test=bc-ice-value]', '2000');
    // The in-browser preview: the band with the most glacier, baseline against this variant.
    await page.waitForFunction(() => /[1-9]/.test(document.querySelector('[data-test=preview-added]')?.textContent ?? ''), null, { timeout: 30_000 });
    expect(await page.textContent('[data-test=preview-added]')).toMatch(/mm w\.e\./);
    await page.screenshot({ path: 'test-results/runs-scenario-builder.png', fullPage: true });
    await page.click('[data-test=save-scenario]');

    await page.waitForSelector(`[data-test="scenario-${name}"]`);
    await page.click(`[data-test="run-${name}"]`);
    await page.click('[data-test=start-run]');
    const row = page.locator('[data-test=runs-table] tbody tr', { hasText: name }).first();
    await row.locator('text=done').waitFor({ timeout: 60_000 });
    await page.screenshot({ path: 'test-results/runs-list.png', fullPage: true });
    await row.locator('[data-test^=results-]').click();

    await page.waitForSelector('[data-test=chart-bands] canvas', { timeout: 30_000 });
    await page.waitForSelector('[data-test=chart-hydrograph] canvas');
    await page.waitForSelector('[data-test=cautions]');
    const volume = await page.textContent('[data-test=total-addedVolumeMillionM3]');
    expect(Number(volume!.replace(/[^0-9.]/g, ''))).toBeGreaterThan(0);
    await page.screenshot({ path: 'test-results/runs-results.png', fullPage: true });

    // A chart's table download carries the cautions too.
    await page.click('[data-test=chart-bands-download]');
    const [download] = await Promise.all([page.waitForEvent('download'), page.click('text=Table (CSV)')]);
    const text = await new Response((await download.createReadStream()) as unknown as ReadableStream).text();
    expect(text).toContain('These results are scenario estimates, not forecasts.');
    expect(text).toContain('Band mean elevation (m)');
    await page.close();
  });

  it('compares an attributed, uncertainty-banded variant with another', async () => {
    // The variant to compare with, run through the API so this test stands alone.
    const agent = await signedInAgent(b.t.app, consultant.email, consultant.password);
    const other = unique('Soot to compare ');
    const baseline = (await agent.get(`/api/catchments/${catchmentId}/scenarios`)).body.scenarios[0];
    // The period a new scenario starts from in the builder, so the two runs can be compared.
    const { defaultPeriod } = (await agent.get(`/api/catchments/${catchmentId}/scenario-setup`)).body;
    const created = await agent.post(`/api/catchments/${catchmentId}/scenarios`).send({
      name: other, changes: { period: baseline.changes.period ?? defaultPeriod ?? SEASON, blackCarbonSnowNgG: 300 + (Date.now() % 200), blackCarbonIceNgG: 1000 },
    });
    expect(created.status).toBe(201);
    const started = await agent.post(`/api/catchments/${catchmentId}/runs`).send({ scenarioId: created.body.scenario.id });
    expect((await waitForRun(agent, catchmentId, started.body.run.id, 90_000)).status).toBe('done');

    const page = await b.newPage();
    await signInThroughForm(page, b.baseUrl, consultant.email, consultant.password);
    await page.goto(`${b.baseUrl}/catchments/${catchmentId}/scenarios/new`);
    const name = unique('Dust and warming ');
    await page.fill('[data-test=scenario-name]', name);
    await page.fill('[data-test=dust-snow-value]', String(40 + (Date.now() % 50)));
    await page.click('[data-test=warming-2]');
    // Black carbon on the ice of the bands from 4000 to 4500 m only.
    await page.click('[data-test=add-range]');
    await page.fill('[data-test=range-0-blackCarbonIceNgG]', '1500');
    expect(await page.inputValue('[data-test=temperature-value]')).toBe('0.91');
    await page.click('[data-test=save-scenario]');
    await page.click(`[data-test="run-${name}"]`);
    await page.click('[data-test=run-attribution]');
    await page.click('[data-test=run-ensemble-on]');
    expect(await page.inputValue('[data-test=run-ensemble]')).toBe('50');
    await page.fill('[data-test=run-ensemble]', '8');
    await page.click('[data-test=start-run]');
    const row = page.locator('[data-test=runs-table] tbody tr', { hasText: name }).first();
    await row.locator('text=done').waitFor({ timeout: 90_000 });

    // The started run is ticked already; tick the first variant's run too, then compare them.
    expect(await row.locator('.q-checkbox[aria-checked=true]').count()).toBe(1);
    await page.locator('[data-test=runs-table] tbody tr', { hasText: other }).first().locator('.q-checkbox').click();
    await page.click('[data-test=show-results]');

    await page.waitForSelector('[data-test=chart-attribution] canvas', { timeout: 30_000 });
    const header = await page.textContent('[data-test=totals-table] thead');
    expect(header).toContain(name);
    expect(header).toContain(other);
    expect(await page.textContent('[data-test=total-addedVolumeM3]')).toContain('5–95 %');
    await page.screenshot({ path: 'test-results/runs-compare.png', fullPage: true });

    // A run over other days is left out of the comparison, and the page says why.
    // A season that differs from the compared runs' whatever earlier tests left as the baseline's period.
    const compared = baseline.changes.period ?? defaultPeriod ?? SEASON;
    const otherDays = compared.from === SEASON.from ? { from: '2022-06-01', to: '2022-09-30' } : SEASON;
    const earlier = await agent.post(`/api/catchments/${catchmentId}/scenarios`).send({ name: unique('Earlier season '), changes: { period: otherDays, blackCarbonSnowNgG: 250 } });
    const earlierRun = (await agent.post(`/api/catchments/${catchmentId}/runs`).send({ scenarioId: earlier.body.scenario.id })).body.run;
    await waitForRun(agent, catchmentId, earlierRun.id, 90_000);
    const url = new URL(page.url());
    url.searchParams.set('runs', `${url.searchParams.get('runs')},${earlierRun.id}`);
    await page.goto(url.toString());
    const banner = await page.waitForSelector('[data-test=results-left-out]');
    expect(await banner.textContent()).toMatch(/runs compared must cover the same days/);
    expect(await page.textContent('[data-test=totals-table] thead')).not.toContain('Earlier season');
    await page.close();
  });
});
