import { readdir } from 'node:fs/promises';
import path from 'node:path';
import type { Test } from 'supertest';
import type TestAgent from 'supertest/lib/agent';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { deriveCatchment } from '../../shared/geodata/derive';
import { outlineFeaturesFromGeoJson } from '../../shared/geodata/outline-features';
import { outlineBatchSchema, type OutlineBatch } from '../../shared/schemas/outline-batches';
import { GeodataStore } from '../../server/services/geodata/geodata-store';
import { scratchFolder, zippedShapefile } from '../../server/services/geodata/test-support/gdal';
import { TenantScope } from '../../server/services/tenant-scope';
import { demoSubCatchments, DEMO_SUB_CATCHMENTS, type DemoSubCatchments, type ProblemOutline } from '../fixtures/geodata/demo-sub-catchments';
import { catchmentFields } from '../support/catchments';
import { createOrganisation, signedInAgent, unique, type TestOrg } from '../support/factories';
import { createTestApp, type TestApp } from '../support/test-app';
import { storeSeries } from '../support/uploads';

let t: TestApp;
let org: TestOrg;
let consultant: TestAgent;
let sourceId: number;
let studyId: number;
let demo: DemoSubCatchments;
const scratch = scratchFolder();
const OPTIONS = { bandWidthM: 200, horizonSectors: 8 };

/** The demo sub-catchments (and any problem outlines) with names of their own, so each test makes new catchments. */
async function outlinesNamed(marker: string, problems: ProblemOutline[] = []) {
  const { outlines } = await demoSubCatchments(problems);
  const names = new Set<string>(DEMO_SUB_CATCHMENTS);
  return { ...outlines, features: outlines.features.map((f) => ({ ...f, properties: Object.fromEntries(Object.entries(f.properties).map(([k, v]) => [k, names.has(v) ? `${marker} ${v}` : v])) })) };
}

interface Files { dem?: Uint8Array | Buffer; outlines?: object | Buffer; outlineName?: string; glaciers?: boolean; debris?: Buffer }
function send(agent: TestAgent, id: number, files: Files, fields: Record<string, string | number | boolean> = {}): Test {
  const req = agent.post(`/api/studies/${id}/outline-batches`);
  for (const [k, v] of Object.entries({ climateFromCatchmentId: sourceId, ...OPTIONS, ...fields })) void req.field(k, String(v));
  if (files.dem !== undefined) void req.attach('dem', Buffer.from(files.dem), { filename: demo.dem.fileName });
  if (files.outlines !== undefined) {
    const bytes = Buffer.isBuffer(files.outlines) ? files.outlines : Buffer.from(JSON.stringify(files.outlines));
    void req.attach('catchmentOutline', bytes, { filename: files.outlineName ?? 'sarvel-sub-catchments.geojson' });
  }
  if (files.glaciers) void req.attach('glacierOutline', Buffer.from(demo.glaciers.bytes), { filename: demo.glaciers.fileName });
  if (files.debris) void req.attach('debrisOutline', files.debris, { filename: 'debris.geojson' });
  return req;
}

async function ready(agent: TestAgent, id: number, token: string): Promise<OutlineBatch> {
  const deadline = Date.now() + 60_000;
  for (;;) {
    const res = await agent.get(`/api/studies/${id}/outline-batches/${token}`);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const batch = outlineBatchSchema.parse(res.body.batch);
    if (batch.status !== 'reading') return batch;
    if (Date.now() > deadline) throw new Error(`batch still reading: ${batch.derivedCount} of ${batch.outlineCount}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

async function preview(files: Files, fields: Record<string, string | number | boolean> = {}, id = studyId): Promise<OutlineBatch> {
  const res = await send(consultant, id, files, fields);
  expect(res.status, JSON.stringify(res.body)).toBe(202);
  return ready(consultant, id, res.body.batch.token);
}

const stored = () => readdir(path.join(t.config.geodata.dir, String(org.organisationId))).catch(() => [] as string[]);
const catchmentsNamed = async (like: string) => Number((await t.db('catchments').where('organisation_id', org.organisationId).where('name', 'like', `${like}%`).count({ n: '*' }).first())!.n);

async function newStudy(agent = consultant, catchmentIds = [sourceId]): Promise<number> {
  const res = await agent.post('/api/studies').send({ name: unique('Region '), catchmentIds, templates: [{ name: 'Soot', changes: { period: { from: '2022-04-01', to: '2022-09-30' }, blackCarbonSnowNgG: 300 } }] });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.study.id as number;
}

beforeAll(async () => {
  t = createTestApp();
  org = await createOrganisation(t.db);
  consultant = await signedInAgent(t.app, org.users.consultant.email);
  sourceId = (await consultant.post('/api/catchments').send(catchmentFields({ latitudeDeg: 33.94, longitudeDeg: 79.31, timeZone: 'Asia/Kolkata', stationName: 'Kolvi gauge camp', stationElevationM: 3650 }))).body.catchment.id;
  await storeSeries(consultant, sourceId, 'temperature-hourly.csv');
  studyId = await newStudy();
  demo = await demoSubCatchments();
}, 60_000);
afterAll(async () => {
  scratch.dispose();
  await t.close();
});

describe('catchments of a study from many outlines over one DEM', () => {
  let made: { id: number; name: string }[];

  it('previews every outline with its area, elevation range and band count, then makes them all with their geodata and derived bands', async () => {
    const marker = unique('Out');
    const res = await send(consultant, studyId, { dem: demo.dem.bytes, outlines: await outlinesNamed(marker), glaciers: true });
    expect(res.status, JSON.stringify(res.body)).toBe(202);
    const reading = outlineBatchSchema.parse(res.body.batch);
    expect(reading.outlines.map((o) => [o.feature, o.name])).toEqual(DEMO_SUB_CATCHMENTS.map((n, i) => [i + 1, `${marker} ${n}`]));
    expect(reading.files.dem.summary.system).toMatch(/UTM zone 44N/);
    const batch = await ready(consultant, studyId, reading.token);
    expect(batch).toMatchObject({ status: 'ready', canConfirm: true, outlineCount: 3, derivedCount: 3 });
    for (const o of batch.outlines) {
      expect(o).toMatchObject({ state: 'derived', problems: [] });
      // 30 m cells of the demo DEM, planimetric on UTM (cells shrink by the scale factor squared, ≈ 0.9992 here).
      const name = o.name!.slice(marker.length + 1) as (typeof DEMO_SUB_CATCHMENTS)[number];
      expect(o.areaKm2! / ((demo.cells[name] * 900) / 1e6)).toBeCloseTo(1, 2);
      expect(o.bandCount).toBe(Math.ceil(o.maxElevationM! / 200) - Math.floor(o.minElevationM! / 200));
    }
    expect(batch.outlines[2].minElevationM).toBeLessThan(batch.outlines[0].minElevationM!);
    expect(batch.outlines[0].glacierAreaKm2).toBeGreaterThan(0);
    // A preview makes nothing.
    expect(await catchmentsNamed(marker)).toBe(0);

    const confirmed = await consultant.post(`/api/studies/${studyId}/outline-batches/${batch.token}/confirm`);
    expect(confirmed.status, JSON.stringify(confirmed.body)).toBe(201);
    made = confirmed.body.created;
    expect(made.map((c) => c.name)).toEqual(DEMO_SUB_CATCHMENTS.map((n) => `${marker} ${n}`));
    expect(confirmed.body.study.catchments.map((c: { catchmentId: number }) => c.catchmentId)).toEqual([sourceId, ...made.map((c) => c.id)]);
    // Confirmed once; the preview stays to say so.
    expect((await consultant.post(`/api/studies/${studyId}/outline-batches/${batch.token}/confirm`)).status).toBe(409);

    const sourceDatasets = Number((await t.db('datasets').where('catchment_id', sourceId).count({ n: '*' }).first())!.n);
    for (const [i, c] of made.entries()) {
      const catchment = (await consultant.get(`/api/catchments/${c.id}`)).body.catchment;
      expect(catchment).toMatchObject({ timeZone: 'Asia/Kolkata', stationName: 'Kolvi gauge camp', stationElevationM: 3650, bandCount: batch.outlines[i].bandCount });
      expect(Math.abs(catchment.latitudeDeg - 33.94)).toBeLessThan(0.1);
      expect(Number((await t.db('datasets').where('catchment_id', c.id).count({ n: '*' }).first())!.n)).toBe(sourceDatasets);
      // Its geodata as an upload of its own leaves them: the DEM, its outline and the region's glaciers, in use, with the derivation that made its bands.
      const uploads = (await consultant.get(`/api/catchments/${c.id}/geodata/uploads`)).body.uploads;
      expect(uploads.map((u: { layer: string }) => u.layer).sort()).toEqual(['catchmentOutline', 'dem', 'glacierOutline']);
      const derivations = (await consultant.get(`/api/catchments/${c.id}/geodata/derivations`)).body.derivations;
      expect(derivations).toEqual([expect.objectContaining({ inUse: true, stale: false, options: { bandWidthM: 200, splitByAspect: false, horizonSectors: 8 } })]);
      const map = await consultant.get(`/api/catchments/${c.id}/geodata/map`);
      expect(map.status).toBe(200);
      expect(map.body.bands).toHaveLength(batch.outlines[i].bandCount!);
    }
    // The batch's own copies of the DEM and glaciers are gone; each catchment keeps its own.
    const names = await stored();
    const kept = await t.db('geodata_uploads').whereIn('catchment_id', made.map((c) => c.id)).pluck('stored_name');
    for (const name of kept) expect(names).toContain(name);
  }, 120_000);

  it('derives each outline exactly as the single-catchment path derives it from the files the catchment keeps', async () => {
    const scope = new TenantScope(t.db, org.organisationId);
    const user = await t.db('users').where('id', org.users.consultant.id).first();
    const { features } = outlineFeaturesFromGeoJson(JSON.parse(JSON.stringify(demo.outlines)), 'catchmentOutline');
    for (const [i, c] of made.entries()) {
      const inUse = await t.ctx.bands.list(scope, c.id, { terrain: true });
      const again = await t.ctx.geodata.derivations.derive(scope, user, c.id, { ...OPTIONS, splitByAspect: false });
      const bands = await t.ctx.geodata.derivations.get(scope, c.id, again.id);
      expect(bands.bands.map(({ hasHorizon: _h, ...b }) => b)).toEqual(inUse.map(({ horizonDeg: _h, aspectClass: _a, ...b }) => b));
      // And as deriving the fixture's outline straight from the DEM (the glaciers aside).
      const direct = deriveCatchment({ dem: demo.raster, catchment: features[i].outline! }, { ...OPTIONS });
      expect(direct.bands.map((b) => [b.lowerM, b.areaKm2, b.slopeDeg, b.aspectDeg, b.skyViewFactor])).toEqual(inUse.map((b) => [b.lowerM, b.areaKm2, b.slopeDeg, b.aspectDeg, b.skyViewFactor]));
      expect(direct.bands.map((b) => b.horizonDeg)).toEqual(inUse.map((b) => b.horizonDeg));
    }
  }, 120_000);

  it('names every outline that cannot be made, by feature number and name, and makes none', async () => {
    // The names of the first test's catchments are taken now; four more outlines are wrong in other ways.
    const marker = made[0].name.split(' ')[0];
    const batch = await preview({ dem: demo.dem.bytes, outlines: await outlinesNamed(marker, ['outside', 'tiny', 'unnamed', 'twice']) });
    expect(batch.canConfirm).toBe(false);
    const byFeature = new Map(batch.outlines.map((o) => [o.feature, o]));
    for (const feature of [1, 2, 3]) expect(byFeature.get(feature)!.problems).toEqual([`Your organisation already has a catchment called "${byFeature.get(feature)!.name}".`]);
    expect(byFeature.get(4)).toMatchObject({ name: 'Kesh ridge beyond the map', state: 'refused', problems: [expect.stringMatching(/lies entirely outside the DEM/)] });
    expect(byFeature.get(5)).toMatchObject({ state: 'derived', problems: [expect.stringMatching(/^It covers only \d cells? of the DEM \(0\.00 km²\); at least 100 are needed/)] });
    expect(byFeature.get(6)).toMatchObject({ name: null, problems: [expect.stringMatching(/^It has no name: give every outline a name in one of the attributes name, catchment, catchment_name\./)] });
    expect(byFeature.get(7)!.problems).toEqual(['Outline 1 has the same name: each catchment needs a name of its own.', `Your organisation already has a catchment called "${batch.outlines[0].name}".`]);
    const before = await t.db('catchments').where('organisation_id', org.organisationId).count({ n: '*' }).first();
    const res = await consultant.post(`/api/studies/${studyId}/outline-batches/${batch.token}/confirm`);
    expect(res.status).toBe(422);
    expect(res.body.error.message).toBe(`Nothing was made. Outline 1 "${batch.outlines[0].name}": Your organisation already has a catchment called "${batch.outlines[0].name}". (7 more problems in the preview.)`);
    expect(res.body.error.details.problems.map((p: { feature: number }) => p.feature)).toEqual([1, 2, 3, 4, 5, 6, 7, 7]);
    expect(await t.db('catchments').where('organisation_id', org.organisationId).count({ n: '*' }).first()).toEqual(before);
    await consultant.delete(`/api/studies/${studyId}/outline-batches/${batch.token}`).expect(204);
  }, 120_000);

  it('makes every catchment or none: a failure on the second outline leaves nothing, and the preview can be confirmed again', async () => {
    const marker = unique('Half');
    const batch = await preview({ dem: demo.dem.bytes, outlines: await outlinesNamed(marker) });
    const filesBefore = await stored();
    const write = GeodataStore.prototype.write;
    let calls = 0;
    const spy = vi.spyOn(GeodataStore.prototype, 'write').mockImplementation(function (this: GeodataStore, ...args) {
      calls += 1;
      if (calls === 2) return Promise.reject(new Error('disk full'));
      return write.apply(this, args);
    });
    try {
      const failed = await consultant.post(`/api/studies/${studyId}/outline-batches/${batch.token}/confirm`);
      expect(failed.status).toBe(500);
    } finally {
      spy.mockRestore();
    }
    expect(calls).toBe(2);
    expect(await catchmentsNamed(marker)).toBe(0);
    expect((await stored()).sort()).toEqual(filesBefore.sort());
    const study = (await consultant.get(`/api/studies/${studyId}`)).body.study;
    expect(study.catchments.some((c: { name: string }) => c.name.startsWith(marker))).toBe(false);
    const again = await consultant.post(`/api/studies/${studyId}/outline-batches/${batch.token}/confirm`);
    expect(again.status, JSON.stringify(again.body)).toBe(201);
    expect(await catchmentsNamed(marker)).toBe(3);
  }, 120_000);

  it('makes the catchments once when the same preview is confirmed several times at once', async () => {
    const marker = unique('Once');
    const batch = await preview({ dem: demo.dem.bytes, outlines: await outlinesNamed(marker) });
    const answers = await Promise.all([1, 2, 3].map(() => consultant.post(`/api/studies/${studyId}/outline-batches/${batch.token}/confirm`)));
    expect(answers.map((a) => a.status).sort()).toEqual([201, 409, 409]);
    expect(answers.find((a) => a.status === 409)!.body.error.message).toMatch(/already been made/);
    expect(await catchmentsNamed(marker)).toBe(3);
    const links = await t.db('study_catchments').where('study_id', studyId).whereIn('catchment_id', t.db('catchments').where('name', 'like', `${marker}%`).select('id')).count({ n: '*' }).first();
    expect(links).toEqual({ n: 3 });
  }, 120_000);

  it('reads the outlines from a zipped shapefile with their NAME attribute', async () => {
    const marker = unique('Shp');
    const zip = zippedShapefile(scratch, 'subcatchments', await outlinesNamed(marker));
    const batch = await preview({ dem: demo.dem.bytes, outlines: Buffer.from(await import('node:fs').then((fs) => fs.readFileSync(zip))), outlineName: 'subcatchments.zip' });
    expect(batch.outlines.map((o) => [o.name, o.state, o.problems])).toEqual(DEMO_SUB_CATCHMENTS.map((n) => [`${marker} ${n}`, 'derived', []]));
    expect(batch.files.catchmentOutline.fileName).toBe('subcatchments.zip');
    const before = await stored();
    await consultant.delete(`/api/studies/${studyId}/outline-batches/${batch.token}`).expect(204);
    // Discarding removes the kept DEM and the map images of every outline.
    expect((await stored()).length).toBe(before.length - 1 - 2 * 3);
    expect((await consultant.get(`/api/studies/${studyId}/outline-batches/${batch.token}`)).status).toBe(404);
  }, 120_000);

  it('refuses files it cannot read in words naming the field, and keeps none of them', async () => {
    const before = (await stored()).sort();
    const outlines = await outlinesNamed(unique('Bad'));
    const notTiff = await send(consultant, studyId, { dem: Buffer.from('not a raster at all'), outlines });
    expect(notTiff.status).toBe(422);
    expect(notTiff.body.error).toMatchObject({ field: 'dem', message: expect.stringMatching(/not a GeoTIFF/) });
    const notJson = await send(consultant, studyId, { dem: demo.dem.bytes, outlines: Buffer.from('name,area\nKolvi,3') });
    expect(notJson.body.error).toMatchObject({ field: 'catchmentOutline', message: expect.stringMatching(/neither GeoJSON nor a zipped shapefile/) });
    const wrongKind = await send(consultant, studyId, { dem: demo.dem.bytes, outlines, outlineName: 'outlines.kml' });
    expect(wrongKind.status).toBe(415);
    expect(wrongKind.body.error.field).toBe('catchmentOutline');
    expect((await send(consultant, studyId, { dem: demo.dem.bytes })).body.error).toMatchObject({ field: 'catchmentOutline' });
    const debris = await send(consultant, studyId, { dem: demo.dem.bytes, outlines, debris: Buffer.from(JSON.stringify(outlines)) });
    expect(debris.status).toBe(422);
    expect(debris.body.error.field).toBe('debrisThicknessM');
    const band = await send(consultant, studyId, { dem: demo.dem.bytes, outlines }, { bandWidthM: 5 });
    expect(band.status).toBe(422);
    expect(band.body.error.field).toBe('bandWidthM');
    // Outline files keep the single path's limit.
    const huge = Buffer.concat([Buffer.from(JSON.stringify(outlines)), Buffer.alloc(50 * 1024 ** 2, ' ')]);
    const tooLarge = await send(consultant, studyId, { dem: demo.dem.bytes, outlines: huge });
    expect(tooLarge.status).toBe(413);
    expect(tooLarge.body.error.message).toMatch(/up to 50 MB/);
    expect((await stored()).sort()).toEqual(before);
  }, 120_000);

  it('reads one file of outlines of an organisation at a time, and an expired preview is gone', async () => {
    const first = await send(consultant, studyId, { dem: demo.dem.bytes, outlines: await outlinesNamed(unique('One')) }, { horizonSectors: 72 });
    expect(first.status).toBe(202);
    const second = await send(consultant, studyId, { dem: demo.dem.bytes, outlines: await outlinesNamed(unique('Two')) });
    expect(second.status).toBe(429);
    expect(second.body.error.message).toMatch(/already reading a file of outlines/);
    await ready(consultant, studyId, first.body.batch.token);
    await t.db('pending_outline_batches').where('token', first.body.batch.token).update({ expires_at: new Date(Date.now() - 1000) });
    expect((await consultant.get(`/api/studies/${studyId}/outline-batches/${first.body.batch.token}`)).status).toBe(410);
    expect((await consultant.get(`/api/studies/${studyId}/outline-batches/${first.body.batch.token}`)).status).toBe(404);
  }, 120_000);

  it('fails a file of outlines the server stops reading, saying so, keeps none of its files, and fails one left by a process gone', async () => {
    const before = (await stored()).sort();
    const res = await send(consultant, studyId, { dem: demo.dem.bytes, outlines: await outlinesNamed(unique('Stop')) }, { horizonSectors: 72 });
    expect(res.status).toBe(202);
    await t.ctx.outlineBatches.derivation.stop(0);
    const batch = await ready(consultant, studyId, res.body.batch.token);
    expect(batch).toMatchObject({ status: 'failed', error: 'The server restarted while the outlines were being read; upload the files again.', canConfirm: false });
    const confirm = await consultant.post(`/api/studies/${studyId}/outline-batches/${batch.token}/confirm`);
    expect(confirm.status).toBe(409);
    expect(confirm.body.error.message).toBe(batch.error);
    expect((await stored()).sort()).toEqual(before);
    await t.db('pending_outline_batches').where('token', batch.token).update({ status: 'reading', error_message: null });
    await t.ctx.outlineBatches.derivation.recover();
    expect((await ready(consultant, studyId, batch.token)).status).toBe('failed');
  }, 120_000);

  it('adds outlines only to a study not yet started', async () => {
    const started = await newStudy();
    await t.db('studies').where('id', started).update({ started_at: new Date() });
    const res = await send(consultant, started, { dem: demo.dem.bytes, outlines: await outlinesNamed(unique('Late')) });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/has been started/);
  });
});

describe('who may make catchments from outlines, and whose', () => {
  let stranger: TestOrg;
  let token: string;

  beforeAll(async () => {
    stranger = await createOrganisation(t.db);
    token = (await preview({ dem: demo.dem.bytes, outlines: await outlinesNamed(unique('Mine')) })).token;
  }, 120_000);

  it('lets admins and consultants; scientists and clients may not read, confirm or discard a preview', async () => {
    for (const role of ['scientist', 'client'] as const) {
      const agent = await signedInAgent(t.app, org.users[role].email);
      expect((await send(agent, studyId, { dem: demo.dem.bytes, outlines: demo.outlines })).status, role).toBe(403);
      expect((await agent.get(`/api/studies/${studyId}/outline-batches/${token}`)).status, role).toBe(403);
      expect((await agent.post(`/api/studies/${studyId}/outline-batches/${token}/confirm`)).status, role).toBe(403);
      expect((await agent.delete(`/api/studies/${studyId}/outline-batches/${token}`)).status, role).toBe(403);
    }
    const admin = await signedInAgent(t.app, org.users.admin.email);
    expect((await admin.get(`/api/studies/${studyId}/outline-batches/${token}`)).status).toBe(200);
  });

  it("answers another organisation's study and preview as not found, before reading any file, and changes nothing of theirs", async () => {
    const foreign = await signedInAgent(t.app, stranger.users.consultant.email);
    const theirStudy = await newStudy(foreign, [(await foreign.post('/api/catchments').send(catchmentFields())).body.catchment.id]);
    const res = await send(foreign, studyId, { dem: demo.dem.bytes, outlines: demo.outlines });
    expect(res.status).toBe(404);
    expect(res.body.error.message).toBe('Study not found.');
    for (const id of [studyId, theirStudy]) {
      expect((await foreign.get(`/api/studies/${id}/outline-batches/${token}`)).status).toBe(404);
      expect((await foreign.post(`/api/studies/${id}/outline-batches/${token}/confirm`)).status).toBe(404);
      expect((await foreign.delete(`/api/studies/${id}/outline-batches/${token}`)).status).toBe(404);
    }
    // The preview is still ours, unconfirmed.
    const mine = await ready(consultant, studyId, token);
    expect(mine.canConfirm).toBe(true);
    expect(await t.db('pending_outline_batches').where('organisation_id', stranger.organisationId).count({ n: '*' }).first()).toEqual({ n: 0 });
  });
});
