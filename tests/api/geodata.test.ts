import { readFileSync } from 'node:fs';
import { readdir } from 'node:fs/promises';
import path from 'node:path';
import type { Test } from 'supertest';
import type TestAgent from 'supertest/lib/agent';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoGeodataFiles, type DemoGeodataFile } from '../../seeds/data/demo-geodata';
import { DEMO_BANDS } from '../../seeds/data/demo-catchment';
import { readGeoTiff } from '../../server/services/geodata/geotiff-reader';
import { encodeGeoTiff } from '../../server/services/geodata/geotiff-writer';
import { buildSimulationInputs } from '../../server/services/catchments/simulation-inputs';
import { scratchFolder, zippedShapefile } from '../../server/services/geodata/test-support/gdal';
import { TenantScope } from '../../server/services/tenant-scope';
import { catchmentFields } from '../support/catchments';
import { createOrganisation, signedInAgent, type TestOrg } from '../support/factories';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let org: TestOrg;
let other: TestOrg;
let consultant: TestAgent;
let catchmentId: number;
const files = demoGeodataFiles();
const file = (layer: DemoGeodataFile['layer']) => files.find((f) => f.layer === layer)!;

function upload(agent: TestAgent, id: number, layer: string, name: string, bytes: Uint8Array | Buffer, fields: Record<string, string> = {}): Test {
  const req = agent.post(`/api/catchments/${id}/geodata/uploads/${layer}`);
  for (const [k, v] of Object.entries(fields)) void req.field(k, v);
  return req.attach('file', Buffer.from(bytes), { filename: name });
}
const send = (agent: TestAgent, f: DemoGeodataFile) => upload(agent, catchmentId, f.layer, f.fileName, f.bytes, f.fields);
async function storedFiles(organisationId: number): Promise<string[]> {
  return readdir(path.join(t.config.geodata.dir, String(organisationId))).catch(() => []);
}

beforeAll(async () => {
  t = createTestApp();
  org = await createOrganisation(t.db);
  other = await createOrganisation(t.db);
  consultant = await signedInAgent(t.app, org.users.consultant.email);
  catchmentId = (await consultant.post('/api/catchments').send(catchmentFields({ latitudeDeg: 33.94, longitudeDeg: 79.31 }))).body.catchment.id;
  await consultant.put(`/api/catchments/${catchmentId}/bands`).send({ bands: DEMO_BANDS }).expect(200);
}, 60_000);
afterAll(() => t.close());

describe('geodata of a catchment: upload, derive, preview, replace', () => {
  it('reads the demo DEM and outlines and says what they hold', async () => {
    for (const layer of ['dem', 'catchmentOutline', 'glacierOutline', 'debrisOutline', 'debrisThickness'] as const) {
      const res = await send(consultant, file(layer));
      expect(res.status, JSON.stringify(res.body)).toBe(201);
      expect(res.body.upload.layer).toBe(layer);
    }
    const { body } = await consultant.get(`/api/catchments/${catchmentId}/geodata/uploads`).expect(200);
    const dem = body.uploads.find((u: { layer: string }) => u.layer === 'dem');
    expect(dem.summary.system).toMatch(/UTM zone 44N/);
    expect(dem.summary.facts[0]).toMatch(/cells of 30 m/);
    expect(body.limits.rasterFileMb).toBe(500);
  }, 60_000);

  it('derives bands as a preview beside the table in use, then replaces it as a new version the old runs keep', async () => {
    const derived = await consultant.post(`/api/catchments/${catchmentId}/geodata/derivations`).send({ bandWidthM: 200, horizonSectors: 8 });
    expect(derived.status, JSON.stringify(derived.body)).toBe(201);
    const d = derived.body.derivation;
    expect(d.bands.map((b: { lowerM: number }) => b.lowerM)).toEqual(DEMO_BANDS.map((b) => b.lowerM));
    expect(d.bands.every((b: { skyViewFactor: number; hasHorizon: boolean }) => b.skyViewFactor > 0.5 && b.skyViewFactor <= 1 && b.hasHorizon)).toBe(true);
    expect(d.hypsometry.length).toBeGreaterThan(d.bands.length);
    expect(d).toMatchObject({ inUse: false, stale: false });
    // the preview changed nothing
    const before = await consultant.get(`/api/catchments/${catchmentId}/bands/versions`).expect(200);
    expect(before.body.versions).toHaveLength(1);

    const applied = await consultant.post(`/api/catchments/${catchmentId}/geodata/derivations/${d.id}/apply`).expect(200);
    expect(applied.body.derivation.inUse).toBe(true);
    const versions = (await consultant.get(`/api/catchments/${catchmentId}/bands/versions`).expect(200)).body.versions;
    expect(versions.map((v: { version: number; source: string }) => [v.version, v.source])).toEqual([[2, 'derived'], [1, 'entered']]);
    const stored = await t.ctx.bands.list(new TenantScope(t.db, org.organisationId), catchmentId, { terrain: true });
    expect(stored[0].skyViewFactor).toBeGreaterThan(0.5);
    expect(stored[0].horizonDeg).toHaveLength(8);
    // the editor's table has no terrain arrays; a hand edit that keeps the ranges keeps the shading
    const { body } = await consultant.get(`/api/catchments/${catchmentId}/bands`).expect(200);
    expect(body.bands[0].horizonDeg).toBeUndefined();
    await consultant.put(`/api/catchments/${catchmentId}/bands`).send({ bands: body.bands.map((b: object) => ({ ...b, debrisThicknessM: 0.2 })) }).expect(200);
    const edited = await t.ctx.bands.list(new TenantScope(t.db, org.organisationId), catchmentId, { terrain: true });
    expect(edited[3].horizonDeg).toEqual(stored[3].horizonDeg);
  }, 60_000);

  it('draws the map: hillshade, outlines, and every catchment cell in a band of the table in use', async () => {
    const { body } = await consultant.get(`/api/catchments/${catchmentId}/geodata/map`).expect(200);
    expect(body.crs.proj4).toMatch(/\+proj=utm \+zone=44/);
    expect(body.units).toHaveLength(body.height);
    for (const runs of body.units) expect(runs.filter((_: number, i: number) => i % 2 === 1).reduce((a: number, b: number) => a + b, 0)).toBe(body.width);
    const used = new Set(body.units.flatMap((runs: number[]) => runs.filter((_, i) => i % 2 === 0)));
    expect(used.size).toBe(body.bands.length + 1);
    expect(body.outlines.glacier.length).toBeGreaterThan(0);
    const png = await consultant.get(`/api/catchments/${catchmentId}/geodata/derivations/${body.derivationId}/hillshade.png`).expect(200);
    expect(png.headers['content-type']).toBe('image/png');
  });

  it('reduces snow-cover maps and the thinning map to observations per band', async () => {
    for (const f of files.filter((x) => x.layer === 'snowCover').slice(0, 2)) {
      const res = await send(consultant, f);
      expect(res.status, JSON.stringify(res.body)).toBe(201);
    }
    const change = await send(consultant, file('elevationChange'));
    expect(change.status, JSON.stringify(change.body)).toBe(201);
    const { body } = await consultant.get(`/api/catchments/${catchmentId}/geodata/observations`).expect(200);
    expect(body.snowCover.map((m: { observedOn: string }) => m.observedOn)).toEqual(['2024-04-20', '2024-05-25']);
    const april = body.snowCover[0];
    expect(april.rows).toHaveLength(DEMO_BANDS.length);
    expect(april.rows.at(-1).snowCoveredFraction).toBeGreaterThan(april.rows[0].snowCoveredFraction);
    const [thinning] = body.elevationChange.filter((c: { fileName: string }) => c.fileName === file('elevationChange').fileName);
    expect(thinning).toMatchObject({ fromDate: '2000-09-15', toDate: '2020-09-15', densityKgM3: 850 });
    expect(thinning.rows[0].balanceMwePerYear).toBeLessThan(-0.5);
    expect(thinning.rows[0].balanceSigmaMwePerYear).toBeGreaterThan(0);
  }, 60_000);

  it('reduces two dated DEMs to the geodetic balance: 10 m lower over 20 years is −0.5 m per year, −0.425 m w.e. per year at 850 kg m⁻³', async () => {
    const { raster } = await readGeoTiff(file('dem').bytes, { field: 'dem' });
    const lower = encodeGeoTiff({ ...raster, values: raster.values.map((z) => z - 10) });
    const res = await consultant.post(`/api/catchments/${catchmentId}/geodata/uploads/elevationChange`)
      .field('changeKind', 'two-dems').field('fromDate', '2000-01-01').field('toDate', '2020-01-01')
      .attach('file', Buffer.from(file('dem').bytes), { filename: 'survey-2000.tif' }).attach('after', Buffer.from(lower), { filename: 'survey-2020.tif' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    // the ice-free ground sank too, which the upload names as a DEM-difference bias
    expect(res.body.upload.summary.notices.map((n: { code: string }) => n.code)).toContain('stable_ground_bias');
    const { body } = await consultant.get(`/api/catchments/${catchmentId}/geodata/observations`).expect(200);
    const pair = body.elevationChange.find((c: { fileName: string }) => c.fileName === 'survey-2000.tif');
    const years = 7305 / 365.25;
    for (const row of pair.rows) {
      expect(row.dhdtMPerYear).toBeCloseTo(-10 / years, 4);
      expect(row.balanceMwePerYear).toBeCloseTo((-10 / years) * 0.85, 4);
    }
  }, 60_000);
});

describe('outlines as zipped shapefiles', () => {
  const scratch = scratchFolder();
  afterAll(() => scratch.dispose());
  it('reads glacier outlines written by ogr2ogr (GDAL) and zipped, the same polygons as the GeoJSON', async () => {
    const json = JSON.parse(new TextDecoder().decode(file('glacierOutline').bytes)) as { features: { geometry: { coordinates: unknown[] } }[] };
    const zip = zippedShapefile(scratch, 'glaciers', json);
    const res = await upload(consultant, catchmentId, 'glacierOutline', 'glaciers.zip', readFileSync(zip));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.upload.summary.system).toMatch(/WGS (84|1984)/);
    expect(res.body.upload.summary.facts[0]).toMatch(new RegExp(`^${json.features[0].geometry.coordinates.length} polygon`));
  });
});

describe('response units and terrain shading on their way to the engine', () => {
  it('splits bands by aspect, stores the units as a table and passes their sky view and horizons to the engine', async () => {
    const derived = await consultant.post(`/api/catchments/${catchmentId}/geodata/derivations`).send({ bandWidthM: 400, horizonSectors: 8, splitByAspect: true });
    expect(derived.status, JSON.stringify(derived.body)).toBe(201);
    const units = derived.body.derivation.bands as { lowerM: number; aspectClass?: string }[];
    expect(units.every((u) => u.aspectClass)).toBe(true);
    expect(units.length).toBeGreaterThan(new Set(units.map((u) => u.lowerM)).size);
    await consultant.post(`/api/catchments/${catchmentId}/geodata/derivations/${derived.body.derivation.id}/apply`).expect(200);

    const scope = new TenantScope(t.db, org.organisationId);
    const { input } = await buildSimulationInputs(scope, t.ctx.bands, catchmentId, { from: '2024-04-01', to: '2024-04-30' });
    expect(input.catchment.bands).toHaveLength(units.length);
    for (const band of input.catchment.bands as { skyViewFactor?: number; horizonDeg?: number[][]; aspectClass?: string }[]) {
      expect(band.aspectClass).toMatch(/^[NESW]$/);
      expect(band.skyViewFactor).toBeGreaterThan(0.3);
      expect(band.horizonDeg).toHaveLength(8);
      expect(band.horizonDeg!.flat().every((v) => v >= -30 && v <= 90)).toBe(true);
    }
    const { body } = await consultant.get(`/api/catchments/${catchmentId}/geodata/map`).expect(200);
    const drawn = new Set(body.units.flatMap((runs: number[]) => runs.filter((_, i) => i % 2 === 0)));
    expect(drawn.size).toBeGreaterThan(new Set(units.map((u) => u.lowerM)).size + 1);
  }, 60_000);
});

describe('bad geodata: a clear refusal and nothing stored', () => {
  const dem = () => file('dem').bytes;
  it.each([
    ['a cut-short GeoTIFF', 'dem', 'cut.tif', () => dem().subarray(0, 4000), 422, 'truncated_file'],
    ['a header claiming 2 GB in a small file', 'dem', 'huge.tif', () => claimHuge(dem()), 422, 'truncated_file'],
    ['a PNG named .tif', 'dem', 'image.tif', () => Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 0]), 422, 'not_a_geotiff'],
    ['a bow-tie polygon', 'catchmentOutline', 'bow.geojson', () => Buffer.from(JSON.stringify({ type: 'Polygon', coordinates: [[[79, 34], [79.1, 34.1], [79.1, 34], [79, 34.1], [79, 34]]] })), 422, 'self_intersection'],
    ['points instead of polygons', 'glacierOutline', 'points.geojson', () => Buffer.from(JSON.stringify({ type: 'Point', coordinates: [79, 34] })), 422, 'empty_outline'],
    ['an empty zip', 'debrisOutline', 'empty.zip', () => Buffer.from([0x50, 0x4b, 0x05, 0x06, ...new Array(18).fill(0)]), 422, 'bad_archive'],
    ['a spreadsheet', 'dem', 'dem.xlsx', () => Buffer.from('PK'), 415, 'unsupported_file'],
  ])('%s', async (_what, layer, name, bytes, status, code) => {
    const before = await storedFiles(org.organisationId);
    const count = (await t.db('geodata_uploads').where('catchment_id', catchmentId).count({ n: '*' }))[0].n;
    const res = await upload(consultant, catchmentId, layer, name, bytes());
    expect(res.status, JSON.stringify(res.body)).toBe(status);
    expect(res.body.error.code).toBe(code);
    expect(res.body.error.message).not.toMatch(/Error|undefined|stack/);
    expect((await t.db('geodata_uploads').where('catchment_id', catchmentId).count({ n: '*' }))[0].n).toBe(count);
    expect(await storedFiles(org.organisationId)).toEqual(before);
  });

  it('asks for the date of a snow-cover map and the survey dates of an elevation change', async () => {
    const snow = await upload(consultant, catchmentId, 'snowCover', 'snow.tif', files.find((f) => f.layer === 'snowCover')!.bytes);
    expect(snow.status).toBe(422);
    expect(snow.body.error.field).toBe('observedOn');
    const change = await upload(consultant, catchmentId, 'elevationChange', 'dhdt.tif', file('elevationChange').bytes, { fromDate: '2020-01-01', toDate: '2010-01-01' });
    expect(change.body.error.field).toBe('toDate');
  });
});

describe('geodata stays inside its organisation', () => {
  it('answers 404 for another organisation\'s catchment before reading any file', async () => {
    const stranger = await signedInAgent(t.app, other.users.consultant.email);
    const res = await upload(stranger, catchmentId, 'dem', 'dem.tif', file('dem').bytes);
    expect(res.status).toBe(404);
    expect(await storedFiles(other.organisationId)).toEqual([]);
    await stranger.get(`/api/catchments/${catchmentId}/geodata/map`).expect(404);
    await stranger.get(`/api/catchments/${catchmentId}/geodata/uploads`).expect(404);
    await stranger.post(`/api/catchments/${catchmentId}/geodata/derivations`).send({}).expect(404);
  });
});

/** The same GeoTIFF with every strip's byte count raised to 2 GB (classic TIFF, either byte order), cut to 4 kB. */
function claimHuge(bytes: Uint8Array): Buffer {
  const copy = Buffer.from(bytes);
  const le = copy.toString('latin1', 0, 2) === 'II';
  const u16 = (at: number) => (le ? copy.readUInt16LE(at) : copy.readUInt16BE(at));
  const u32 = (at: number) => (le ? copy.readUInt32LE(at) : copy.readUInt32BE(at));
  const ifd = u32(4);
  for (let k = 0; k < u16(ifd); k++) {
    const at = ifd + 2 + k * 12;
    if (u16(at) !== 279) continue;
    const [type, count] = [u16(at + 2), u32(at + 4)];
    const size = type === 4 ? 4 : 2;
    const first = count * size <= 4 ? at + 8 : u32(at + 8);
    for (let n = 0; n < count; n++) {
      if (type === 4) { if (le) copy.writeUInt32LE(2 ** 31, first + n * 4); else copy.writeUInt32BE(2 ** 31, first + n * 4); } else if (le) copy.writeUInt16LE(65535, first + n * 2); else copy.writeUInt16BE(65535, first + n * 2);
    }
  }
  return Buffer.concat([copy.subarray(0, 4096), copy.subarray(ifd)]);
}
