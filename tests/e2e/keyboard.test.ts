import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { DEMO_ACCOUNTS } from '../../seeds/data/demo-accounts';
import { DEMO_BRIEFING } from '../../seeds/data/demo-briefing';
import { DEMO_CATCHMENT } from '../../seeds/data/demo-catchment';
import { openBrowser, type BrowserSession } from '../support/browser';
import { seedDemoWorld } from '../support/demo-world';
import { unique } from '../support/factories';
import { focusIndicator, focusIsIn, tabTo } from '../support/keyboard';

// The main journeys with the keyboard alone: no clicks, only Tab, Enter, Space and typing.
let b: BrowserSession;
let catchmentId: number;
let briefingId: number;
const account = (role: string) => DEMO_ACCOUNTS.find((a) => a.role === role)!;

beforeAll(async () => {
  b = await openBrowser();
  ({ catchment: catchmentId, briefing: briefingId } = await seedDemoWorld(b.t.db));
});
afterAll(async () => {
  await b?.close();
});

async function signInByKeyboard(page: Page, role: string): Promise<void> {
  const { email, password } = account(role);
  await page.goto(`${b.baseUrl}/sign-in`);
  await page.waitForSelector('[data-test=email]');
  await tabTo(page, '[data-test=email]');
  await page.keyboard.type(email);
  await page.keyboard.press('Tab');
  expect(await focusIsIn(page, '[data-test=password]')).toBe(true);
  await page.keyboard.type(password);
  await page.keyboard.press('Enter');
  await page.waitForSelector('[data-test=main-nav]');
}

describe('the keyboard alone', () => {
  it('signs in, skips to the content and sees where the focus is', async () => {
    const page = await b.newPage();
    await signInByKeyboard(page, 'consultant');
    await page.keyboard.press('Tab');
    expect(await page.evaluate(() => document.activeElement?.textContent?.trim())).toBe('Skip to content');
    expect(await focusIndicator(page)).toMatch(/^(outline|shadow) /);
    await page.keyboard.press('Enter');
    expect(await page.evaluate(() => document.activeElement?.id)).toBe('main-content');
    await page.close();
  });

  it('creates a catchment from the list and opens a catchment from its row', async () => {
    const page = await b.newPage();
    await signInByKeyboard(page, 'consultant');
    await page.goto(`${b.baseUrl}/catchments`);
    await page.waitForSelector('[data-test=catchment-table] tbody tr a');
    await tabTo(page, '[data-test=new-catchment]');
    await page.keyboard.press('Enter');
    await page.waitForSelector('[role=dialog]');
    // The dialog has its name and takes the focus to its first field.
    expect(await page.getAttribute('[role=dialog]', 'aria-labelledby')).toBeTruthy();
    await page.waitForFunction(() => Boolean(document.activeElement?.closest('[data-test=catchment-name]')));
    const name = unique('Keyboard valley ');
    await page.keyboard.type(name);
    await tabTo(page, '[data-test=catchment-latitude]');
    await page.keyboard.press('ControlOrMeta+A');
    await page.keyboard.type('46.5');
    // The time-zone picker holds the canonical names Chromium's own list lacks, found by typing.
    await tabTo(page, '[data-test=catchment-time-zone]');
    await page.keyboard.type('Kolkata');
    await page.waitForSelector('[role=option]:has-text("Asia/Kolkata")');
    await page.keyboard.press('ArrowDown');
    await page.keyboard.press('Enter');
    await tabTo(page, '[data-test=catchment-station]');
    await page.keyboard.type('Keyboard station');
    await tabTo(page, '[data-test=catchment-station-elevation]');
    await page.keyboard.press('ControlOrMeta+A');
    await page.keyboard.type('2100');
    await tabTo(page, '[data-test=catchment-save]');
    await page.keyboard.press('Enter');
    await page.waitForSelector(`[data-test=catchment-title]:has-text("${name}")`);
    expect(await b.t.db('catchments').where({ name }).first('time_zone')).toEqual({ time_zone: 'Asia/Kolkata' });

    await page.goto(`${b.baseUrl}/catchments`);
    await page.waitForSelector(`[data-test=catchment-link-${catchmentId}]`);
    await tabTo(page, `[data-test=catchment-link-${catchmentId}]`);
    await page.keyboard.press('Enter');
    await page.waitForSelector(`[data-test=catchment-title]:has-text("${DEMO_CATCHMENT.name}")`);
    await page.close();
  });

  it('refuses a half-typed time zone with a message instead of saving another zone', async () => {
    const page = await b.newPage();
    await signInByKeyboard(page, 'consultant');
    await page.goto(`${b.baseUrl}/catchments`);
    await tabTo(page, '[data-test=new-catchment]');
    await page.keyboard.press('Enter');
    await page.waitForFunction(() => Boolean(document.activeElement?.closest('[data-test=catchment-name]')));
    await page.keyboard.type(unique('Half-typed zone '));
    await tabTo(page, '[data-test=catchment-time-zone]');
    // A misspelt zone that matches nothing in the list (a match would be taken with Tab, as a picker does).
    await page.keyboard.type('Asia/Kolkatta');
    await tabTo(page, '[data-test=catchment-save]');
    await page.keyboard.press('Enter');
    await page.waitForSelector('[role=dialog] >> text=is not a time zone; choose one from the list');
    await page.screenshot({ path: 'test-results/keyboard-half-typed-zone.png' });
    expect(page.url()).toMatch(/\/catchments$/);
    await page.close();
  });

  it('builds a scenario, runs it and opens its results', async () => {
    const page = await b.newPage();
    await signInByKeyboard(page, 'consultant');
    await page.goto(`${b.baseUrl}/catchments/${catchmentId}?tab=runs`);
    await page.waitForSelector('[data-test="scenario-Baseline"]');
    await tabTo(page, '[data-test=new-scenario]');
    await page.keyboard.press('Enter');
    await page.waitForSelector('[data-test=scenario-form]');
    const name = unique('Keyboard soot ');
    await tabTo(page, '[data-test=scenario-name]');
    await page.keyboard.type(name);
    await tabTo(page, '[data-test=bc-snow-value]');
    await page.keyboard.press('ControlOrMeta+A');
    await page.keyboard.type(String(500 + (Date.now() % 300)));
    await tabTo(page, '[data-test=save-scenario]');
    await page.keyboard.press('Enter');

    await page.waitForSelector(`[data-test="run-${name}"]`);
    await tabTo(page, `[data-test="run-${name}"]`);
    await page.keyboard.press('Enter');
    await page.waitForSelector('[data-test=run-dialog]');
    await tabTo(page, '[data-test=start-run]');
    await page.keyboard.press('Enter');
    const row = page.locator('[data-test=runs-table] tbody tr', { hasText: name }).first();
    await row.locator('text=done').waitFor({ timeout: 60_000 });
    const runId = (await row.locator('[data-test^=results-]').getAttribute('data-test'))!.slice('results-'.length);
    await tabTo(page, `[data-test=results-${runId}]`);
    await page.keyboard.press('Enter');
    await page.waitForSelector('[data-test=results]', { timeout: 30_000 });
    expect(await page.textContent('h1')).toBe('Added melt results');
    await page.close();
  });

  it('takes a client from the list of briefings to one and its download', async () => {
    const page = await b.newPage();
    await signInByKeyboard(page, 'client');
    await page.goto(`${b.baseUrl}/briefings`);
    await page.waitForSelector('[data-test=briefing-list]');
    await tabTo(page, `[data-test=briefing-${briefingId}]`);
    await page.keyboard.press('Enter');
    await page.waitForSelector('[data-test=briefing-title]');
    expect(await page.textContent('h1')).toBe(DEMO_BRIEFING.title);
    await tabTo(page, '[data-test=download-pdf]');
    expect(await focusIndicator(page)).toMatch(/^(outline|shadow) /);
    await page.close();
  });
});
