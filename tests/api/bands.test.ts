import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { catchmentFields } from '../support/catchments';
import { createOrganisation, signedInAgent, type TestOrg } from '../support/factories';
import { createTestApp, type TestApp } from '../support/test-app';
import { fixture } from '../support/uploads';

let t: TestApp;
let org: TestOrg;
let agent: Awaited<ReturnType<typeof signedInAgent>>;

const band = (lowerM: number, upperM: number, extra: Record<string, number> = {}) => ({
  lowerM, upperM, areaKm2: 3.2, slopeDeg: 20, aspectDeg: 180, glacierFraction: 0.4, debrisFraction: 0.5, debrisThicknessM: 0.2, ...extra,
});

beforeAll(async () => {
  t = createTestApp();
  org = await createOrganisation(t.db);
  agent = await signedInAgent(t.app, org.users.consultant.email);
});
afterAll(() => t.close());

async function newCatchment(): Promise<number> {
  return (await agent.post('/api/catchments').send(catchmentFields())).body.catchment.id;
}

describe('saving a band table', () => {
  it('stores contiguous bands in the engine units and reads them back in order', async () => {
    const id = await newCatchment();
    const bands = [band(3000, 3200), band(3200, 3400, { debrisFraction: 0 }), band(3400, 3700)];
    const res = await agent.put(`/api/catchments/${id}/bands`).send({ bands });
    expect(res.status).toBe(200);
    expect((await agent.get(`/api/catchments/${id}/bands`)).body.bands).toEqual(bands);
    expect((await agent.get(`/api/catchments/${id}`)).body.catchment.bandCount).toBe(3);
  });

  it.each([
    ['overlapping bands', [band(3000, 3200), band(3100, 3400)], 'bands.1.lowerM', 'Row 2, lower elevation: overlaps the band below (its upper edge is 3200 m)'],
    ['a gap between bands', [band(3000, 3200), band(3300, 3400)], 'bands.1.lowerM', 'Row 2, lower elevation: leaves a gap above the band below'],
    ['a fraction above 1', [band(3000, 3200, { glacierFraction: 1.2 })], 'bands.0.glacierFraction', 'Row 1, glacier fraction: must be between 0 and 1'],
    ['a zero area', [band(3000, 3200), band(3200, 3400, { areaKm2: 0 })], 'bands.1.areaKm2', 'Row 2, area: must be more than 0 km²'],
    ['an implausible elevation', [band(9000, 9500)], 'bands.0.upperM', 'Row 1, upper elevation: must be between -500 and 9000 m'],
    ['an upper edge below the lower', [band(3200, 3000)], 'bands.0.upperM', 'Row 1, upper elevation: must be above the lower elevation'],
  ])('refuses %s, naming row and field, and keeps the stored table', async (_what, bands, field, message) => {
    const id = await newCatchment();
    const good = [band(2000, 2500)];
    await agent.put(`/api/catchments/${id}/bands`).send({ bands: good });
    const res = await agent.put(`/api/catchments/${id}/bands`).send({ bands });
    expect(res.status).toBe(422);
    expect(res.body.error.field).toBe(field);
    expect(res.body.error.message).toContain(message);
    expect((await agent.get(`/api/catchments/${id}/bands`)).body.bands).toEqual(good);
  });

  it('refuses an empty table', async () => {
    const res = await agent.put(`/api/catchments/${await newCatchment()}/bands`).send({ bands: [] });
    expect(res.status).toBe(422);
    expect(res.body.error.message).toContain('needs at least one band');
  });

  it('does not let a scientist change bands', async () => {
    const scientist = await signedInAgent(t.app, org.users.scientist.email);
    expect((await scientist.put(`/api/catchments/${await newCatchment()}/bands`).send({ bands: [band(1, 2)] })).status).toBe(403);
  });
});

describe('band files', () => {
  it('reads a good band file into rows without storing it', async () => {
    const id = await newCatchment();
    const res = await agent.post(`/api/catchments/${id}/bands/file`).attach('file', fixture('bands.csv'), { filename: 'bands.csv', contentType: 'text/csv' });
    expect(res.status).toBe(200);
    expect(res.body.problems).toEqual([]);
    expect(res.body.bands).toHaveLength(5);
    expect(res.body.bands[0]).toMatchObject({ lowerM: 3000, upperM: 3400, debrisThicknessM: 0.25 });
    expect((await agent.get(`/api/catchments/${id}/bands`)).body.bands).toEqual([]);
  });

  it('lists the problems of a bad band file by row and column', async () => {
    const id = await newCatchment();
    const res = await agent.post(`/api/catchments/${id}/bands/file`).attach('file', fixture('bands-overlap.csv'), { filename: 'b.csv', contentType: 'text/csv' });
    expect(res.body.problems).toEqual(expect.arrayContaining([
      expect.objectContaining({ row: 4, column: 'glacierFraction' }),
    ]));
  });

  it('refuses a band file without the expected header', async () => {
    const id = await newCatchment();
    const res = await agent.post(`/api/catchments/${id}/bands/file`).attach('file', Buffer.from('from,to\n1,2\n'), { filename: 'b.csv', contentType: 'text/csv' });
    expect(res.status).toBe(422);
    expect(res.body.error.message).toContain('Lower elevation (m), Upper elevation (m), Area (km²)');
    expect(res.body.error.message).not.toMatch(/lowerM|areaKm2/);
  });

  it('downloads the band table as CSV', async () => {
    const id = await newCatchment();
    await agent.put(`/api/catchments/${id}/bands`).send({ bands: [band(3000, 3200)] });
    const res = await agent.get(`/api/catchments/${id}/bands.csv`);
    expect(res.headers['content-disposition']).toContain('attachment');
    // With a byte-order mark, so spreadsheet programs read it as UTF-8.
    expect(res.text).toBe('\uFEFFLower elevation (m),Upper elevation (m),Area (km²),Mean slope (°),Mean aspect (° from north),Glacier fraction (0–1 of band),Debris-covered fraction (0–1 of glacier),Debris thickness (m)\r\n3000,3200,3.2,20,180,0.4,0.5,0.2\r\n');
  });

  it('reads back the file it downloads', async () => {
    const id = await newCatchment();
    await agent.put(`/api/catchments/${id}/bands`).send({ bands: [band(3000, 3200), band(3200, 3400)] });
    const file = (await agent.get(`/api/catchments/${id}/bands.csv`)).text;
    const res = await agent.post(`/api/catchments/${id}/bands/file`).attach('file', Buffer.from(file), { filename: 'b.csv', contentType: 'text/csv' });
    expect(res.body.problems).toEqual([]);
    expect(res.body.bands).toEqual((await agent.get(`/api/catchments/${id}/bands`)).body.bands);
  });
});
