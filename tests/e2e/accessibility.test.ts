import { mkdirSync, writeFileSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS } from '../../seeds/data/demo-accounts';
import { seedDemoWorld, type DemoWorld } from '../support/demo-world';
import { blockingFindings, checkAccessibility, type AxeReport } from '../support/axe';
import { openBrowser, settled, signInThroughForm, type BrowserSession } from '../support/browser';

// Every page and dialog of the demo, in light and dark mode, checked by axe-core (WCAG 2.2 A/AA): none may
// have a critical or serious violation. The counts of every level go to test-results/axe-report.json.
let b: BrowserSession;
let ids: DemoWorld;
const report: Record<string, AxeReport['counts']> = {};
const account = (role: string) => DEMO_ACCOUNTS.find((a) => a.role === role)!;
type Theme = 'light' | 'dark';

beforeAll(async () => {
  b = await openBrowser();
  ids = await seedDemoWorld(b.t.db);
});
afterAll(async () => {
  mkdirSync('test-results', { recursive: true });
  writeFileSync('test-results/axe-report.json', `${JSON.stringify(report, null, 2)}\n`);
  await b?.close();
});

async function themedPage(theme: Theme): Promise<Page> {
  const page = await b.newPage();
  await page.addInitScript((dark) => localStorage.setItem('tarnish.dark', dark ? 'on' : 'off'), theme === 'dark');
  return page;
}

/** Waits for the page's content (spinners gone), runs axe and records the counts under `name`. */
async function audit(page: Page, name: string, theme: Theme): Promise<string[]> {
  await page.waitForFunction(() => !document.querySelector('.q-inner-loading, .q-table__progress, .q-spinner'), undefined, { timeout: 15_000 }).catch(() => undefined);
  await settled(page);
  const result = await checkAccessibility(page);
  report[`${name} (${theme})`] = result.counts;
  await page.screenshot({ path: `test-results/a11y-${theme}-${name.replace(/[^a-z0-9]+/gi, '-')}.png` });
  const headings = await page.locator('h1').count();
  const structure = headings === 1 ? [] : [`${headings} h1 elements (one expected)`];
  return [...structure, ...blockingFindings(result)].map((line) => `${name} (${theme}): ${line}`);
}

async function visit(page: Page, path: string, ready: string, name: string, theme: Theme): Promise<string[]> {
  await page.goto(`${b.baseUrl}${path}`);
  await page.waitForSelector(ready);
  return audit(page, name, theme);
}

/** Opens a dialog with `opener`, checks it, and closes it with Escape. */
async function dialog(page: Page, opener: string, name: string, theme: Theme): Promise<string[]> {
  await page.click(opener);
  await page.waitForSelector('[role=dialog]');
  // Named by its title, with the focus inside it (on its first field).
  await page.waitForFunction(() => Boolean(document.activeElement?.closest('[role=dialog]')));
  const named = await page.evaluate(() => document.getElementById(document.querySelector('[role=dialog]')?.getAttribute('aria-labelledby') ?? '')?.textContent ?? '');
  const found = [...(named ? [] : [`${name} (${theme}): the dialog has no name`]), ...(await audit(page, name, theme))];
  await page.keyboard.press('Escape');
  // A dialog that must not close by accident (an upload under way) closes with its own button.
  const stillOpen = await page.waitForSelector('[role=dialog]', { state: 'detached', timeout: 1000 }).then(() => false, () => true);
  if (stillOpen) await page.locator('[role=dialog]').getByRole('button', { name: /cancel|close/i }).first().click();
  await page.waitForSelector('[role=dialog]', { state: 'detached' });
  return found;
}

describe.each<Theme>(['light', 'dark'])('accessibility in %s mode', (theme) => {
  it('signed-out pages', async () => {
    const page = await themedPage(theme);
    const found = [
      ...(await visit(page, '/sign-in', '[data-test=email]', 'sign-in', theme)),
      ...(await visit(page, '/sign-up', 'input', 'sign-up', theme)),
      ...(await visit(page, '/forgot-password', 'input', 'forgot-password', theme)),
      ...(await visit(page, '/reset-password?token=nothing', 'input', 'reset-password', theme)),
      ...(await visit(page, '/no-such-page', 'text=Page not found', 'not-found', theme)),
    ];
    await page.close();
    expect(found).toEqual([]);
  });

  it("the workshop's pages and dialogs, as the admin", async () => {
    const page = await themedPage(theme);
    const admin = account('admin');
    await signInThroughForm(page, b.baseUrl, admin.email, admin.password);
    const c = `/catchments/${ids.catchment}`;
    const found = [
      ...(await audit(page, 'overview', theme)),
      ...(await visit(page, '/catchments', '[data-test=catchment-table] tbody tr', 'catchments', theme)),
      ...(await dialog(page, '[data-test=new-catchment]', 'new catchment dialog', theme)),
      ...(await visit(page, c, '[data-test=catchment-title]', 'catchment details', theme)),
      ...(await visit(page, `${c}?tab=bands`, '[data-test=catchment-tabs]', 'catchment bands', theme)),
      ...(await visit(page, `${c}?tab=climate`, '[data-test=catchment-tabs]', 'catchment climate', theme)),
      ...(await dialog(page, '[data-test=upload-climate]', 'upload dialog', theme)),
      ...(await visit(page, `${c}?tab=observations`, '[data-test=catchment-tabs]', 'catchment observations', theme)),
      ...(await visit(page, `${c}?tab=geodata`, '[data-test=catchment-tabs]', 'catchment geodata', theme)),
      ...(await visit(page, `${c}?tab=runs`, '[data-test="run-Baseline"]', 'catchment runs', theme)),
      ...(await dialog(page, '[data-test="run-Baseline"]', 'run dialog', theme)),
      ...(await visit(page, `${c}/scenarios/${ids.baseline}`, 'input', 'scenario builder', theme)),
      ...(await visit(page, `${c}/results?runs=${ids.run}`, '.echarts, canvas, svg', 'results', theme)),
      ...(await visit(page, '/lab', '[data-test=lab-catchment]', 'lab', theme)),
      ...(await visit(page, '/briefings', '[data-test=new-briefing]', 'briefings', theme)),
      ...(await dialog(page, '[data-test=new-briefing]', 'new briefing dialog', theme)),
      ...(await visit(page, `/briefings/${ids.briefing}/edit`, 'input, textarea', 'briefing draft', theme)),
      ...(await visit(page, `/briefings/${ids.briefing}`, '.q-page', 'briefing reading (team)', theme)),
      ...(await visit(page, '/team', '[data-test=open-invite]', 'team', theme)),
      ...(await dialog(page, '[data-test=open-invite]', 'invitation dialog', theme)),
      ...(await visit(page, '/account', 'input', 'account', theme)),
      ...(await visit(page, '/billing', '.q-page', 'billing', theme)),
    ];
    await page.close();
    expect(found).toEqual([]);
  });

  it("the client's pages", async () => {
    const page = await themedPage(theme);
    const client = account('client');
    await signInThroughForm(page, b.baseUrl, client.email, client.password);
    const found = [
      ...(await audit(page, 'overview (client)', theme)),
      ...(await visit(page, '/briefings', '.q-page', 'briefings (client)', theme)),
      ...(await visit(page, `/briefings/${ids.briefing}`, '.q-page', 'briefing reading (client)', theme)),
    ];
    await page.close();
    expect(found).toEqual([]);
  });

  it('phones: the main pages fit 390 px, wide tables scroll inside their card', async () => {
    const page = await themedPage(theme);
    const admin = account('admin');
    await signInThroughForm(page, b.baseUrl, admin.email, admin.password);
    // A phone's screen, after signing in (the navigation waited for is folded away on a phone).
    await page.setViewportSize({ width: 390, height: 844 });
    const c = `/catchments/${ids.catchment}`;
    const pages = [
      ['catchment', `${c}?tab=bands`, '[data-test=band-table]'],
      ['scenario', `${c}/scenarios/${ids.baseline}`, '[data-test=scenario-form]'],
      ['results', `${c}/results?runs=${ids.run}`, '[data-test=totals-table]'],
      ['briefing', `/briefings/${ids.briefing}`, '[data-test=briefing-title]'],
    ] as const;
    const overflowing: string[] = [];
    for (const [name, path, ready] of pages) {
      await page.goto(`${b.baseUrl}${path}`);
      await page.waitForSelector(ready);
      await settled(page);
      await page.screenshot({ path: `test-results/phone-${theme}-${name}.png`, fullPage: true });
      // Nothing wider than the screen: wide tables scroll in their own box, the page never sideways.
      const width = await page.evaluate(() => document.documentElement.scrollWidth);
      if (width > 391) overflowing.push(`${name}: ${width} px wide`);
    }
    // The results header keeps its title on one line (it collapsed to one word per line before).
    await page.goto(`${b.baseUrl}${c}/results?runs=${ids.run}`);
    const title = await page.waitForSelector('h1');
    expect((await title.boundingBox())!.height).toBeLessThan(40);
    await page.close();
    expect(overflowing).toEqual([]);
  });
});
