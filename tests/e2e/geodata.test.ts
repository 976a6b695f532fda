import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seed as seedOrganisation } from '../../seeds/01_demo_organisation';
import { DEMO_ACCOUNTS } from '../../seeds/data/demo-accounts';
import { DEMO_BANDS, DEMO_CATCHMENT } from '../../seeds/data/demo-catchment';
import { demoGeodataFiles } from '../../seeds/data/demo-geodata';
import { openBrowser, settled, signInThroughForm, type BrowserSession } from '../support/browser';
import { catchmentFields } from '../support/catchments';
import { signedInAgent } from '../support/factories';

let b: BrowserSession;
let folder: string;
const consultant = DEMO_ACCOUNTS.find((a) => a.role === 'consultant')!;

beforeAll(async () => {
  b = await openBrowser();
  await seedOrganisation(b.t.db);
  folder = mkdtempSync(path.join(tmpdir(), 'tarnish-e2e-geodata-'));
}, 60_000);
afterAll(async () => {
  await b?.close();
  rmSync(folder, { recursive: true, force: true });
});

/** Writes a demo file where a user would keep it, named as it would be uploaded. */
function onDisk(layer: string): string {
  const f = demoGeodataFiles().find((x) => x.layer === layer)!;
  const file = path.join(folder, f.fileName);
  writeFileSync(file, f.bytes);
  return file;
}

describe('a catchment from its elevation model and outlines, in the browser', () => {
  it('uploads the demo DEM and outlines, derives bands, shows the map and replaces the band table', async () => {
    // A catchment of its own with the demo's hand-made bands, so the demo catchment stays as other tests expect it.
    const agent = await signedInAgent(b.t.app, consultant.email, consultant.password);
    const id: number = (await agent.post('/api/catchments').send(catchmentFields({ latitudeDeg: DEMO_CATCHMENT.latitudeDeg, longitudeDeg: DEMO_CATCHMENT.longitudeDeg }))).body.catchment.id;
    await agent.put(`/api/catchments/${id}/bands`).send({ bands: DEMO_BANDS }).expect(200);
    const page = await b.newPage();
    await signInThroughForm(page, b.baseUrl, consultant.email, consultant.password);
    await page.goto(`${b.baseUrl}/catchments/${id}?tab=geodata`);
    await page.waitForSelector('[data-test=geodata-limits]:has-text("500 MB")');

    for (const layer of ['dem', 'catchmentOutline', 'glacierOutline', 'debrisOutline']) {
      await page.setInputFiles(`[data-test=geodata-file-${layer}]`, onDisk(layer));
      await page.waitForSelector(`[data-test=geodata-layer-${layer}]:has-text("${demoGeodataFiles().find((f) => f.layer === layer)!.fileName}")`);
    }
    await page.waitForSelector('[data-test=geodata-layer-dem]:has-text("WGS 84 / UTM zone 44N")');

    // a wrong file is refused in words, and the DEM in use stays
    await page.setInputFiles('[data-test=geodata-file-dem]', { name: 'notes.tif', mimeType: 'image/tiff', buffer: Buffer.from('not a raster at all') });
    await page.waitForSelector('[data-test=geodata-error-dem]:has-text("not a GeoTIFF")');
    await page.waitForSelector('[data-test=geodata-layer-dem]:has-text("upper-sarvel-dem-30m.tif")');

    await page.fill('[data-test=derive-debris]', '0.15');
    await page.click('[data-test=derive-bands]');
    await page.waitForSelector('[data-test=derived-table] tbody tr', { timeout: 60_000 });
    expect(await page.locator('[data-test=derived-table] tbody tr').count()).toBe(DEMO_BANDS.length);
    await page.waitForSelector('[data-test=derived-hypsometry] canvas');
    await settled(page);
    await page.screenshot({ path: 'test-results/geodata-derived.png', fullPage: true });

    await page.click('[data-test=tab-map]');
    await page.waitForSelector('[data-test=catchment-map-canvas] canvas', { timeout: 30_000 });
    expect(await page.locator('[data-test=catchment-map-legend] .swatch').count()).toBe(DEMO_BANDS.length);
    await page.click('[data-test=catchment-map-view] >> text=Table');
    await page.waitForSelector('[data-test=catchment-map-table] tbody tr', { state: 'attached' });
    expect(await page.locator('[data-test=catchment-map-table] tbody tr').count()).toBe(DEMO_BANDS.length);
    await page.click('[data-test=catchment-map-view] >> text=Map');
    await page.waitForFunction(() => {
      const canvas = document.querySelector<HTMLCanvasElement>('[data-test=catchment-map-canvas] canvas');
      return !!canvas && canvas.width > 0;
    });
    const download = page.waitForEvent('download');
    await page.click('[data-test=catchment-map-png]');
    expect((await download).suggestedFilename()).toMatch(/\.png$/);
    await settled(page);
    await page.screenshot({ path: 'test-results/geodata-map.png', fullPage: true });

    await page.click('[data-test=tab-geodata]');
    await page.click('[data-test=derived-apply]');
    await page.click('[data-test=derived-apply-confirm]');
    await page.waitForSelector('[data-test=derived-in-use]');
    const versions = await b.t.db('band_tables').where({ catchment_id: id }).orderBy('version').select('version', 'source');
    expect(versions.map((v: { source: string }) => v.source)).toEqual(['entered', 'derived']);
    const terrain = await b.t.db('elevation_bands').where('band_table_id', b.t.db('band_tables').where({ catchment_id: id }).max('id')).whereNotNull('sky_view_factor').count({ n: '*' });
    expect(Number(terrain[0].n)).toBe(DEMO_BANDS.length);
  }, 180_000);
});
