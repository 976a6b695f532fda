import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoSubCatchments, DEMO_SUB_CATCHMENTS, type DemoSubCatchments } from '../fixtures/geodata/demo-sub-catchments';
import { checkAccessibility } from '../support/axe';
import { openBrowser, settled, signInThroughForm, type BrowserSession } from '../support/browser';
import { catchmentFields } from '../support/catchments';
import { createOrganisation, signedInAgent, TEST_PASSWORD, unique, type TestOrg } from '../support/factories';
import { storeSeries } from '../support/uploads';

let b: BrowserSession;
let folder: string;
let demo: DemoSubCatchments;
let studyId: number;
let org: TestOrg;
/** The catchment of the valley's station, whose record the new catchments use. */
const STATION_CATCHMENT = unique('Kolvi gauge ');

beforeAll(async () => {
  b = await openBrowser();
  // An organisation of its own, so the sub-catchments' names are free whatever ran before.
  org = await createOrganisation(b.t.db);
  folder = mkdtempSync(path.join(tmpdir(), 'tarnish-e2e-outlines-'));
  demo = await demoSubCatchments(['tiny', 'unnamed']);
  const agent = await signedInAgent(b.t.app, org.users.consultant.email);
  const station = (await agent.post('/api/catchments').send(catchmentFields({ name: STATION_CATCHMENT, latitudeDeg: 33.94, longitudeDeg: 79.31 }))).body.catchment.id as number;
  await storeSeries(agent, station, 'temperature-hourly.csv');
  const res = await agent.post('/api/studies').send({
    name: 'Sarvel sub-catchments', catchmentIds: [station],
    templates: [{ name: 'Valley soot', changes: { period: { from: '2024-04-01', to: '2024-09-30' }, blackCarbonSnowNgG: 250 } }],
  });
  studyId = res.body.study.id;
}, 120_000);
afterAll(async () => {
  await b?.close();
  rmSync(folder, { recursive: true, force: true });
});

/** A file where a user would keep it, written once (a browser cannot read a chosen file changed on disk since). */
function onDisk(name: string, bytes: Uint8Array | string): string {
  const file = path.join(folder, name);
  if (!existsSync(file)) writeFileSync(file, bytes);
  return file;
}

/** Axe findings of any level on what the page shows now, and whether it has its one h1. */
async function findings(page: Page): Promise<string[]> {
  const report = await checkAccessibility(page);
  const h1 = await page.locator('h1').count();
  return [...(h1 === 1 ? [] : [`${h1} h1 elements`]), ...report.findings.flatMap((f) => f.nodes.map((n) => `${f.impact} ${f.id}: ${n.target}`))];
}

/** Waits until every outline is derived; the status line then. */
async function readStatus(page: Page): Promise<string> {
  await page.click('[data-test=outlines-read]');
  await page.waitForFunction(() => {
    const status = document.querySelector('[data-test=outlines-status]')?.textContent ?? '';
    return status !== '' && !status.startsWith('Deriving') || document.querySelector('[data-test=outlines-error]');
  }, undefined, { timeout: 90_000 });
  return (await page.textContent('[data-test=outlines-status]').catch(() => null)) ?? `refused: ${await page.textContent('[data-test=outlines-error]')}`;
}

async function chooseFiles(page: Page, outlines: object, name: string): Promise<void> {
  await page.setInputFiles('[data-test=outlines-dem]', onDisk(demo.dem.fileName, demo.dem.bytes));
  await page.setInputFiles('[data-test=outlines-file]', onDisk(name, JSON.stringify(outlines)));
  await page.setInputFiles('[data-test=outlines-glaciers]', onDisk(demo.glaciers.fileName, demo.glaciers.bytes));
  await page.click('[data-test=outlines-station]');
  await page.click(`.q-menu .q-item:has-text("${STATION_CATCHMENT}")`);
  await page.fill('[data-test=derive-band-width]', '200');
}

describe('a study\'s catchments from outlines over one DEM, in the browser', () => {
  it('previews the outlines with their problems, then makes the good ones into catchments that show in the study', async () => {
    const page = await b.newPage();
    await signInThroughForm(page, b.baseUrl, org.users.consultant.email, TEST_PASSWORD);
    await page.goto(`${b.baseUrl}/studies/${studyId}`);
    await page.click('[data-test=study-add-outlines]');
    await page.waitForSelector('[data-test=study-outline-upload]');
    expect(await page.textContent('[data-test=study-outline-upload]')).toContain('name, catchment, catchment_name');

    // First a file with two outlines that cannot be catchments: the preview says which and why, and nothing can be made.
    await chooseFiles(page, demo.outlines, 'sarvel-sub-catchments-draft.geojson');
    expect(await readStatus(page)).toMatch(/^2 of 5 outlines have problems/);
    expect(await page.textContent('[data-test=outline-4-state]')).toMatch(/covers only \d+ cells? of the DEM/);
    expect(await page.textContent('[data-test=outline-5-state]')).toMatch(/It has no name/);
    expect(await page.textContent('[data-test=outline-preview-table]')).toContain(DEMO_SUB_CATCHMENTS[2]);
    expect(await page.isDisabled('[data-test=outlines-confirm]')).toBe(true);
    await settled(page);
    await page.screenshot({ path: 'test-results/study-outlines-problems.png', fullPage: true });
    expect(await findings(page)).toEqual([]);
    await page.click('[data-test=outlines-discard]');

    // The corrected file: the three sub-catchments only.
    await chooseFiles(page, { ...demo.outlines, features: demo.outlines.features.slice(0, 3) }, 'sarvel-sub-catchments.geojson');
    expect(await readStatus(page)).toMatch(/^All 3 outlines can be made into catchments/);
    await settled(page);
    await page.screenshot({ path: 'test-results/study-outlines-ready.png', fullPage: true });
    expect(await findings(page)).toEqual([]);
    await page.setViewportSize({ width: 390, height: 844 });
    await settled(page);
    await page.screenshot({ path: 'test-results/study-outlines-phone.png', fullPage: true });
    // Nothing wider than the phone but the table, which scrolls inside its card.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await page.setViewportSize({ width: 1280, height: 860 });

    await page.click('[data-test=outlines-confirm]');
    await page.waitForSelector('text=3 catchments added to the study.');
    for (const name of DEMO_SUB_CATCHMENTS) await page.waitForSelector(`[data-test=study-catchments-table] tbody tr:has-text("${name}")`);
    expect(await page.locator('[data-test=study-catchments-table] tbody tr').count()).toBe(4);
    await settled(page);
    await page.screenshot({ path: 'test-results/study-outlines-added.png', fullPage: true });
    // Each is a catchment of its own with the bands derived from its outline.
    const made = await b.t.db('catchments').where('organisation_id', org.organisationId).whereIn('name', DEMO_SUB_CATCHMENTS).select('id', 'name');
    expect(made).toHaveLength(3);
    const tables = await b.t.db('band_tables').whereIn('catchment_id', made.map((c: { id: number }) => c.id)).select('source');
    expect(tables.map((r: { source: string }) => r.source)).toEqual(['derived', 'derived', 'derived']);
    await page.close();
  }, 300_000);
});
