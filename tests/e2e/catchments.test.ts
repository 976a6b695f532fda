import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seed as seedOrganisation } from '../../seeds/01_demo_organisation';
import { seed as seedCatchment } from '../../seeds/02_demo_catchment';
import { DEMO_ACCOUNTS } from '../../seeds/data/demo-accounts';
import { DEMO_CATCHMENT } from '../../seeds/data/demo-catchment';
import { openBrowser, settled, signInThroughForm, type BrowserSession } from '../support/browser';
import { unique } from '../support/factories';

let b: BrowserSession;
const consultant = DEMO_ACCOUNTS.find((a) => a.role === 'consultant')!;
const client = DEMO_ACCOUNTS.find((a) => a.role === 'client')!;
const FIXTURES = path.join(import.meta.dirname, '..', 'fixtures', 'csv');
const GAP_FILE = path.join(FIXTURES, 'temperature-hourly-gap.csv');
const GOOD_BANDS = path.join(FIXTURES, 'bands.csv');
const BAD_BANDS = path.join(FIXTURES, 'bands-overlap.csv');


beforeAll(async () => {
  b = await openBrowser();
  await seedOrganisation(b.t.db);
  await seedCatchment(b.t.db);
});
afterAll(() => b?.close());

describe('catchments in the browser', () => {
  it('shows the demo catchment with its bands, hypsometry and climate charts', async () => {
    const page = await b.newPage();
    await signInThroughForm(page, b.baseUrl, consultant.email, consultant.password);
    await page.click('[data-test=nav-catchments]');
    await page.fill('[data-test=catchment-search]', 'Sarvel');
    const row = page.locator('[data-test=catchment-table] tbody tr', { hasText: DEMO_CATCHMENT.name });
    await row.waitFor();
    await page.waitForFunction(() => document.querySelectorAll('[data-test=catchment-table] tbody tr').length === 1);
    await settled(page);
    await page.screenshot({ path: 'test-results/catchments-list.png' });
    await row.click();
    await page.waitForSelector(`[data-test=catchment-title]:has-text("${DEMO_CATCHMENT.name}")`);
    await settled(page);
    await page.screenshot({ path: 'test-results/catchment-details.png' });

    await page.click('[data-test=tab-bands]');
    await page.waitForSelector('[data-test=hypsometry-chart] canvas');
    expect(await page.locator('[data-test=band-table] tbody tr').count()).toBe(21);
    await settled(page);
    await page.screenshot({ path: 'test-results/catchment-bands.png', fullPage: true });

    await page.click('[data-test=tab-climate]');
    await page.click('[data-test=dataset-temperature]');
    await page.waitForSelector('[data-test=series-chart]:has-text("Air temperature") canvas');
    await page.waitForSelector('[data-test=monthly-table]');
    expect(await page.textContent('[data-test=completeness-temperature]')).toBe('99.98 % complete');
    await settled(page);
    await page.screenshot({ path: 'test-results/catchment-climate.png', fullPage: true });

    await page.click('[data-test=tab-observations]');
    await page.waitForSelector('[data-test=dataset-discharge]');
    await page.waitForSelector('[data-test=series-chart] canvas');
    await settled(page);
    await page.screenshot({ path: 'test-results/catchment-observations.png', fullPage: true });
    await page.click('[data-test=dataset-pointBalance]');
    await page.waitForSelector('[data-test=stake-chart] canvas');
    await settled(page);
    await page.screenshot({ path: 'test-results/catchment-stakes.png', fullPage: true });
    await page.close();
  });

  it('lets a consultant create a catchment, upload temperature, see the flagged gap, confirm and see the chart', async () => {
    const page = await b.newPage();
    await signInThroughForm(page, b.baseUrl, consultant.email, consultant.password);
    await page.goto(`${b.baseUrl}/catchments`);
    await page.click('[data-test=new-catchment]');
    const name = unique('Browser basin ');
    await page.fill('[data-test=catchment-name]', name);
    await page.fill('[data-test=catchment-latitude]', '33.5');
    await page.fill('[data-test=catchment-longitude]', '78.2');
    await page.fill('[data-test=catchment-station]', 'Upper camp');
    await page.fill('[data-test=catchment-station-elevation]', '3650');
    await page.click('[data-test=catchment-save]');
    await page.waitForSelector(`[data-test=catchment-title]:has-text("${name}")`);

    await page.click('[data-test=tab-climate]');
    await page.click('[data-test=upload-climate]');
    await page.fill('[data-test=upload-source]', 'Upper camp logger, own maintenance');
    await page.setInputFiles('[data-test=upload-dialog] input[type=file]', GAP_FILE);
    await page.click('[data-test=upload-read]');
    await page.waitForSelector('[data-test=upload-preview]');
    const problems = await page.textContent('[data-test=preview-problems]');
    expect(problems).toContain('no values from 2024-01-02 06:00 to 2024-01-02 11:00 (6 hours)');
    expect(await page.textContent('[data-test=preview-unit]')).toContain('°C');
    await settled(page);
    await page.screenshot({ path: 'test-results/upload-preview.png', fullPage: true });

    await page.click('[data-test=upload-confirm]');
    await page.waitForSelector('[data-test=series-chart] canvas');
    expect(await page.textContent('[data-test=completeness-temperature]')).toContain('91.67 %');
    await settled(page);
    await page.screenshot({ path: 'test-results/upload-chart.png', fullPage: true });

    const [svg] = await Promise.all([page.waitForEvent('download'), page.click('[data-test=series-chart-download]').then(() => page.click('text=Drawing (SVG)'))]);
    expect(svg.suggestedFilename()).toMatch(/^temperature-\d+\.svg$/);
    await page.click('[data-test=series-chart-view] >> text=Table');
    await page.waitForSelector('[data-test=series-chart] table >> text=2024-01-01 00:00');
    // The picture downloads from the table view too (it is drawn off screen from the chart's option).
    const [png] = await Promise.all([page.waitForEvent('download'), page.click('[data-test=series-chart-download]').then(() => page.click('text=Picture (PNG)'))]);
    expect(png.suggestedFilename()).toMatch(/^temperature-\d+\.png$/);
    const pngBytes = Buffer.from(await new Response((await png.createReadStream()) as unknown as ReadableStream).arrayBuffer());
    expect(pngBytes.subarray(1, 4).toString()).toBe('PNG');
    expect(pngBytes.length).toBeGreaterThan(5000);

    await page.click('[data-test=tab-bands]');
    await page.setInputFiles('[data-test=band-file]', BAD_BANDS);
    await page.waitForSelector('[data-test=band-problems] >> text=Row 4, glacier fraction: must be between 0 and 1');
    // Every problem at once, by row: the overlap of row 3 beside the fraction of row 4.
    expect(await page.locator('[data-test=band-problems] li').allTextContents()).toEqual([
      'Row 3, lower elevation: overlaps the band below (its upper edge is 3800 m); sort bands from low to high without overlaps',
      'Row 4, glacier fraction: must be between 0 and 1',
    ]);
    await page.setInputFiles('[data-test=band-file]', GOOD_BANDS);
    await page.waitForSelector('[data-test=band-problems]', { state: 'detached' });
    await page.click('[data-test=band-save]');
    await page.waitForSelector('[data-test=hypsometry-chart] canvas');
    await page.waitForSelector('[data-test=tab-bands] >> text=Bands (5)');
    await settled(page);
    await page.screenshot({ path: 'test-results/bands-from-file.png', fullPage: true });
    await page.close();
  });

  it('shows a scientist the data without any way to change it', async () => {
    const scientist = DEMO_ACCOUNTS.find((a) => a.role === 'scientist')!;
    const page = await b.newPage();
    await signInThroughForm(page, b.baseUrl, scientist.email, scientist.password);
    const [{ id }] = await b.t.db('catchments').where('name', DEMO_CATCHMENT.name).select('id');
    await page.goto(`${b.baseUrl}/catchments/${id}?tab=climate`);
    await page.waitForSelector('[data-test=series-chart] canvas');
    expect(await page.locator('[data-test=upload-climate]').count()).toBe(0);
    await page.click('[data-test=tab-bands]');
    await page.waitForSelector('[data-test=band-table] >> text=6800');
    expect(await page.locator('[data-test=band-save]').count()).toBe(0);
    expect(await page.locator('[data-test=band-table] input').count()).toBe(0);
    expect(await page.locator('[data-test=new-catchment]').count()).toBe(0);
    await page.close();
  });

  it('keeps a client out of catchments', async () => {
    const page = await b.newPage();
    await signInThroughForm(page, b.baseUrl, client.email, client.password);
    await page.goto(`${b.baseUrl}/catchments`);
    await page.waitForSelector('text=Your role does not give access to that page.');
    expect(new URL(page.url()).pathname).toBe('/');
    await page.close();
  });
});
