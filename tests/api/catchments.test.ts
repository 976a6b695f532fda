import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MAX_PAGE_SIZE } from '../../shared/schemas/catchments';
import { DEMO_BANDS } from '../../seeds/data/demo-catchment';
import { catchmentFields } from '../support/catchments';
import { createDemoCatchment } from '../support/lab-catchment';
import { createOrganisation, signedInAgent, unique, type TestOrg } from '../support/factories';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let orgA: TestOrg;
let orgB: TestOrg;
let foreignId: number;

beforeAll(async () => {
  t = createTestApp();
  orgA = await createOrganisation(t.db);
  orgB = await createOrganisation(t.db);
  const b = await signedInAgent(t.app, orgB.users.consultant.email);
  foreignId = (await b.post('/api/catchments').send(catchmentFields())).body.catchment.id;
});
afterAll(() => t.close());

describe('creating and editing catchments', () => {
  it('lets a consultant create, read and edit a catchment', async () => {
    const agent = await signedInAgent(t.app, orgA.users.consultant.email);
    const created = await agent.post('/api/catchments').send(catchmentFields({ name: unique('Kesh ') }));
    expect(created.status).toBe(201);
    expect(created.body.catchment).toMatchObject({ latitudeDeg: 33.2, timeZone: 'Asia/Kolkata', archived: false, bandCount: 0 });
    const id = created.body.catchment.id;
    const edited = await agent.put(`/api/catchments/${id}`).send(catchmentFields({ name: created.body.catchment.name, stationElevationM: 3333 }));
    expect(edited.status).toBe(200);
    expect((await agent.get(`/api/catchments/${id}`)).body.catchment.stationElevationM).toBe(3333);
  });

  it('names the bad field', async () => {
    const agent = await signedInAgent(t.app, orgA.users.admin.email);
    const res = await agent.post('/api/catchments').send(catchmentFields({ timeZone: 'Mars/Olympus' }));
    expect(res.status).toBe(422);
    expect(res.body.error.field).toBe('timeZone');
    const lat = await agent.post('/api/catchments').send(catchmentFields({ latitudeDeg: 95 }));
    expect(lat.body.error.field).toBe('latitudeDeg');
  });

  it('refuses a second catchment with the same name', async () => {
    const agent = await signedInAgent(t.app, orgA.users.consultant.email);
    const fields = catchmentFields();
    await agent.post('/api/catchments').send(fields);
    const again = await agent.post('/api/catchments').send(fields);
    expect(again.status).toBe(409);
    expect(again.body.error.field).toBe('name');
  });

  it('deletes a catchment without runs and archives on request', async () => {
    const agent = await signedInAgent(t.app, orgA.users.consultant.email);
    const a = (await agent.post('/api/catchments').send(catchmentFields())).body.catchment.id;
    const archived = await agent.post(`/api/catchments/${a}/archive`).send({ archived: true });
    expect(archived.body.catchment.archived).toBe(true);
    expect((await agent.delete(`/api/catchments/${a}`)).body.outcome).toBe('deleted');
    expect((await agent.get(`/api/catchments/${a}`)).status).toBe(404);
  });
});

describe('a catchment with runs', () => {
  it('is archived, not deleted, so its runs stay reproducible', async () => {
    const agent = await signedInAgent(t.app, orgA.users.consultant.email);
    const id = (await agent.post('/api/catchments').send(catchmentFields())).body.catchment.id;
    const { id: scenarioId } = await t.db('scenarios').where({ catchment_id: id, is_baseline: true }).first('id');
    await t.db('runs').insert({
      organisation_id: orgA.organisationId, catchment_id: id, scenario_id: scenarioId, scenario_name: 'Baseline', is_baseline: true,
      changes: '{}', engine_version: 'test', input_hash: 'x'.repeat(64),
    });
    const res = await agent.delete(`/api/catchments/${id}`);
    expect(res.body.outcome).toBe('archived');
    const kept = await agent.get(`/api/catchments/${id}`);
    expect(kept.status).toBe(200);
    expect(kept.body.catchment.archived).toBe(true);
    const listed = await agent.get('/api/catchments').query({ archived: 'true', search: kept.body.catchment.name });
    expect(listed.body.catchments.map((c: { id: number }) => c.id)).toEqual([id]);
  });
});

describe('the catchment list', () => {
  it('pages, sorts and searches on the server and caps the page size', async () => {
    const agent = await signedInAgent(t.app, orgA.users.consultant.email);
    const tag = unique('Paging');
    for (let i = 0; i < 5; i++) await agent.post('/api/catchments').send(catchmentFields({ name: `${tag} ${i}`, stationElevationM: 3000 + i }));
    const page = await agent.get('/api/catchments').query({ search: tag, perPage: 2, page: 2, sort: 'stationElevationM', descending: 'true' });
    expect(page.status).toBe(200);
    expect(page.body.total).toBe(5);
    expect(page.body.catchments.map((c: { name: string }) => c.name)).toEqual([`${tag} 2`, `${tag} 1`]);
    // The last page (not full), a page past the end and a page holding everything tell the same total.
    for (const [perPage, pageNumber, rows] of [[2, 3, 1], [2, 4, 0], [10, 1, 5], [5, 1, 5]] as const) {
      const res = await agent.get('/api/catchments').query({ search: tag, perPage, page: pageNumber });
      expect([res.body.total, res.body.catchments.length], `${perPage} a page, page ${pageNumber}`).toEqual([5, rows]);
    }
    const capped = await agent.get('/api/catchments').query({ perPage: 10_000 });
    expect(capped.body.perPage).toBe(MAX_PAGE_SIZE);
    const bad = await agent.get('/api/catchments').query({ sort: 'password_hash' });
    expect(bad.status).toBe(422);
  });

  it("shows each catchment's band and dataset counts as the catchment's own page does", async () => {
    const org = await createOrganisation(t.db);
    const withData = await createDemoCatchment(t.db, org.organisationId);
    const agent = await signedInAgent(t.app, org.users.consultant.email);
    const empty = (await agent.post('/api/catchments').send(catchmentFields())).body.catchment.id as number;
    const list = (await agent.get('/api/catchments')).body.catchments as { id: number; bandCount: number; datasetCount: number }[];
    expect(list.map((c) => c.id).sort()).toEqual([withData, empty].sort());
    for (const listed of list) expect(listed).toEqual((await agent.get(`/api/catchments/${listed.id}`)).body.catchment);
    const shown = list.find((c) => c.id === withData)!;
    expect(shown.bandCount).toBe(DEMO_BANDS.length);
    expect(shown.datasetCount).toBeGreaterThan(0);
    expect(list.find((c) => c.id === empty)).toMatchObject({ bandCount: 0, datasetCount: 0 });
  });

  it('treats % and _ in the search as plain characters', async () => {
    const agent = await signedInAgent(t.app, orgA.users.consultant.email);
    const res = await agent.get('/api/catchments').query({ search: '%' });
    expect(res.body.total).toBe(0);
  });
});

describe('roles and organisations', () => {
  it('lets a scientist read but not write', async () => {
    const agent = await signedInAgent(t.app, orgA.users.scientist.email);
    expect((await agent.get('/api/catchments')).status).toBe(200);
    expect((await agent.post('/api/catchments').send(catchmentFields())).status).toBe(403);
  });

  it.each([
    ['GET', ''], ['PUT', ''], ['DELETE', ''], ['POST', '/archive'], ['GET', '/bands'], ['PUT', '/bands'], ['GET', '/bands.csv'],
    ['GET', '/datasets'], ['POST', '/uploads'],
  ])("answers 404 for another organisation's catchment on %s …%s", async (method, suffix) => {
    const agent = await signedInAgent(t.app, orgA.users.consultant.email);
    // Well-formed bodies: a malformed one is refused (422) before any catchment is looked up.
    const oneBand = { lowerM: 3000, upperM: 3200, areaKm2: 1, slopeDeg: 20, aspectDeg: 180, glacierFraction: 0.4, debrisFraction: 0, debrisThicknessM: 0 };
    const body = method === 'PUT' && suffix === '' ? catchmentFields() : method === 'POST' ? { archived: true } : { bands: [oneBand] };
    const res = await agent[method.toLowerCase() as 'post'](`/api/catchments/${foreignId}${suffix}`).send(body);
    expect(res.status).toBe(404);
    const list = await agent.get('/api/catchments').query({ perPage: 100 });
    expect(list.body.catchments.map((c: { id: number }) => c.id)).not.toContain(foreignId);
  });
});
