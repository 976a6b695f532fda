import path from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seed as seedOrganisation } from '../../seeds/01_demo_organisation';
import { seed as seedCatchment } from '../../seeds/02_demo_catchment';
import { DEMO_ACCOUNTS } from '../../seeds/data/demo-accounts';
import { DEMO_CATCHMENT } from '../../seeds/data/demo-catchment';
import { openBrowser, signInThroughForm, type BrowserSession } from '../support/browser';
import { unique } from '../support/factories';

let b: BrowserSession;
const consultant = DEMO_ACCOUNTS.find((a) => a.role === 'consultant')!;
const client = DEMO_ACCOUNTS.find((a) => a.role === 'client')!;
const GAP_FILE = path.join(import.meta.dirname, '..', 'fixtures', 'csv', 'temperature-hourly-gap.csv');

/** Charts draw on the next animation frame after their canvas appears; wait for it before a screenshot. */
const settle = (page: Page) => page.waitForTimeout(400);

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
    await settle(page);
    await page.screenshot({ path: 'test-results/catchments-list.png' });
    await row.click();
    await page.waitForSelector(`[data-test=catchment-title]:has-text("${DEMO_CATCHMENT.name}")`);
    await settle(page);
    await page.screenshot({ path: 'test-results/catchment-details.png' });

    await page.click('[data-test=tab-bands]');
    await page.waitForSelector('[data-test=hypsometry-chart] canvas');
    expect(await page.locator('[data-test=band-table] tbody tr').count()).toBe(21);
    await settle(page);
    await page.screenshot({ path: 'test-results/catchment-bands.png', fullPage: true });

    await page.click('[data-test=tab-climate]');
    await page.click('[data-test=dataset-temperature]');
    await page.waitForSelector('[data-test=series-chart]:has-text("Air temperature") canvas');
    await page.waitForSelector('[data-test=monthly-table]');
    expect(await page.textContent('[data-test=completeness-temperature]')).toBe('99.98 % complete');
    await settle(page);
    await page.screenshot({ path: 'test-results/catchment-climate.png', fullPage: true });

    await page.click('[data-test=tab-observations]');
    await page.waitForSelector('[data-test=dataset-discharge]');
    await page.waitForSelector('[data-test=series-chart] canvas');
    await settle(page);
    await page.screenshot({ path: 'test-results/catchment-observations.png', fullPage: true });
    await page.click('[data-test=dataset-pointBalance]');
    await page.waitForSelector('[data-test=stake-chart] canvas');
    await settle(page);
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
    await settle(page);
    await page.screenshot({ path: 'test-results/upload-preview.png', fullPage: true });

    await page.click('[data-test=upload-confirm]');
    await page.waitForSelector('[data-test=series-chart] canvas');
    expect(await page.textContent('[data-test=completeness-temperature]')).toContain('91.67 %');
    await settle(page);
    await page.screenshot({ path: 'test-results/upload-chart.png', fullPage: true });
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
