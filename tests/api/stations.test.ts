import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { catchmentFields } from '../support/catchments';
import { createOrganisation, signedInAgent, type TestOrg } from '../support/factories';
import { createTestApp, type TestApp } from '../support/test-app';
import { storeSeries } from '../support/uploads';

let t: TestApp;
let org: TestOrg;
let other: TestOrg;
let agent: Awaited<ReturnType<typeof signedInAgent>>;

const band = (lowerM: number, upperM: number) => ({
  lowerM, upperM, areaKm2: 3, slopeDeg: 20, aspectDeg: 180, glacierFraction: 0.3, debrisFraction: 0, debrisThicknessM: 0,
});
const station = (overrides: Record<string, unknown> = {}) => ({
  name: 'Upper moraine mast', network: 'Invented Alpine Survey', instrument: 'Ventilated thermistor, weighing gauge with wind shield',
  elevationM: 4200, latitudeDeg: 33.21, longitudeDeg: 75.41,
  accuracy: [{ variable: 'temperature', statement: '±0.2 °C' }, { variable: 'precipitation', statement: '±5 %, undercatch of snow 20–40 %' }],
  licence: 'Invented open-data licence; data provided for research', ...overrides,
});

beforeAll(async () => {
  t = createTestApp();
  org = await createOrganisation(t.db);
  other = await createOrganisation(t.db);
  agent = await signedInAgent(t.app, org.users.consultant.email);
});
afterAll(() => t.close());

/** Daily mean temperature for ten January days, lower by `offsetK` (a higher station), as a CSV. */
const dailyTemperature = (offsetK: number, skipDay = -1) => Buffer.from(['date,temperature_c', ...Array.from({ length: 10 }, (_, d) => d)
  .filter((d) => d !== skipDay).map((d) => `2024-01-${String(d + 1).padStart(2, '0')},${(-5 + 3 * Math.sin(d) - offsetK).toFixed(2)}`)].join('\n'));

async function newCatchment(): Promise<number> {
  const id = (await agent.post('/api/catchments').send(catchmentFields({ stationName: 'Valley camp', stationElevationM: 3100 }))).body.catchment.id;
  await agent.put(`/api/catchments/${id}/bands`).send({ bands: [band(3000, 3500), band(3500, 4000), band(4000, 4600)] });
  return id;
}

describe('stations of a catchment', () => {
  it('starts with the reference station, the catchment’s own, and adds others with their provenance', async () => {
    const id = await newCatchment();
    const before = (await agent.get(`/api/catchments/${id}/stations`)).body.stations;
    expect(before).toHaveLength(1);
    expect(before[0]).toMatchObject({ name: 'Valley camp', elevationM: 3100, isReference: true });
    const created = await agent.post(`/api/catchments/${id}/stations`).send(station());
    expect(created.status).toBe(201);
    expect(created.body.station).toMatchObject({ ...station(), isReference: false, datasetCount: 0 });
    const listed = (await agent.get(`/api/catchments/${id}/stations`)).body.stations;
    expect(listed.map((s: { name: string }) => s.name)).toEqual(['Valley camp', 'Upper moraine mast']);
  });

  it('keeps the reference station and the catchment’s station in step, both ways', async () => {
    const id = await newCatchment();
    const reference = (await agent.get(`/api/catchments/${id}/stations`)).body.stations[0];
    await agent.put(`/api/catchments/${id}/stations/${reference.id}`).send(station({ name: 'Valley camp AWS', elevationM: 3120 }));
    expect((await agent.get(`/api/catchments/${id}`)).body.catchment).toMatchObject({ stationName: 'Valley camp AWS', stationElevationM: 3120 });
    await agent.put(`/api/catchments/${id}`).send(catchmentFields({ name: (await agent.get(`/api/catchments/${id}`)).body.catchment.name, stationName: 'Valley camp 2', stationElevationM: 3130 }));
    expect((await agent.get(`/api/catchments/${id}/stations`)).body.stations[0]).toMatchObject({ name: 'Valley camp 2', elevationM: 3130, network: 'Invented Alpine Survey' });
  });

  it.each([
    ['a station above the catchment’s top', { elevationM: 4700 }, 'elevationM', 'lies above the catchment\'s highest band (4600 m)'],
    ['a latitude without a longitude', { longitudeDeg: null }, 'longitudeDeg', 'give both latitude and longitude'],
    ['the same variable’s accuracy twice', { accuracy: [{ variable: 'temperature', statement: 'a' }, { variable: 'temperature', statement: 'b' }] }, 'accuracy', 'once'],
    ['an observation as a station variable', { accuracy: [{ variable: 'discharge', statement: '±10 %' }] }, 'accuracy.0.variable', 'climate variables'],
    ['no name', { name: ' ' }, 'name', 'required'],
  ])('refuses %s, naming the field, and stores nothing', async (_what, change, field, message) => {
    const id = await newCatchment();
    const res = await agent.post(`/api/catchments/${id}/stations`).send(station(change));
    expect(res.status).toBe(422);
    expect(res.body.error.field).toBe(field);
    expect(res.body.error.message).toContain(message);
    expect((await agent.get(`/api/catchments/${id}/stations`)).body.stations).toHaveLength(1);
  });

  it('refuses a second station of the same name, and deleting the reference station or one with datasets', async () => {
    const id = await newCatchment();
    const upper = (await agent.post(`/api/catchments/${id}/stations`).send(station())).body.station;
    expect((await agent.post(`/api/catchments/${id}/stations`).send(station())).status).toBe(409);
    const reference = (await agent.get(`/api/catchments/${id}/stations`)).body.stations.find((s: { isReference: boolean }) => s.isReference);
    const refused = await agent.delete(`/api/catchments/${id}/stations/${reference.id}`);
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toContain('reference station');
    await storeSeries(agent, id, 'temperature-hourly.csv', { variable: 'temperature', stationId: String(upper.id) });
    const busy = await agent.delete(`/api/catchments/${id}/stations/${upper.id}`);
    expect(busy.status).toBe(409);
    expect(busy.body.error.message).toContain('1 dataset');
  });
});

describe('datasets belong to a station', () => {
  it('files a climate upload under the reference station unless another is chosen, and can move it', async () => {
    const id = await newCatchment();
    const upper = (await agent.post(`/api/catchments/${id}/stations`).send(station())).body.station;
    const own = await storeSeries(agent, id, 'temperature-hourly.csv', { variable: 'temperature' });
    const reference = (await agent.get(`/api/catchments/${id}/stations`)).body.stations.find((s: { isReference: boolean }) => s.isReference);
    expect(own).toMatchObject({ stationId: reference.id, stationName: 'Valley camp' });
    const moved = await agent.put(`/api/catchments/${id}/datasets/${own.id}/station`).send({ stationId: upper.id });
    expect(moved.status).toBe(200);
    expect(moved.body.dataset).toMatchObject({ stationId: upper.id, stationName: 'Upper moraine mast' });
    const none = await agent.put(`/api/catchments/${id}/datasets/${own.id}/station`).send({ stationId: null });
    expect(none.status).toBe(422);
    expect(none.body.error.field).toBe('stationId');
  });

  it('drives the engine from the reference station only: another station’s series never becomes the forcing', async () => {
    const id = await newCatchment();
    const upper = (await agent.post(`/api/catchments/${id}/stations`).send(station())).body.station;
    await storeSeries(agent, id, 'precipitation-daily.csv', { variable: 'precipitation' });
    await storeSeries(agent, id, 'temperature-hourly.csv', { variable: 'temperature', stationId: String(upper.id) });
    expect((await agent.get(`/api/catchments/${id}/scenario-setup`)).body.record).toBeNull();
    await storeSeries(agent, id, 'temperature-hourly.csv', { variable: 'temperature' });
    expect((await agent.get(`/api/catchments/${id}/scenario-setup`)).body.record).not.toBeNull();
  });
});

describe('comparing overlapping records of two stations', () => {
  it('reports bias and correlation over the common days, without merging', async () => {
    const id = await newCatchment();
    const upper = (await agent.post(`/api/catchments/${id}/stations`).send(station())).body.station;
    const low = await storeSeries(agent, id, dailyTemperature(0), { variable: 'temperature' });
    // 1100 m higher at −6.5 K km⁻¹, one day missing: the days in common are the nine both hold.
    const high = await storeSeries(agent, id, dailyTemperature(7.15, 4), { variable: 'temperature', stationId: String(upper.id), source: 'Invented Alpine Survey' });
    const res = await agent.get(`/api/catchments/${id}/stations/compare`).query({ first: low.id, second: high.id });
    expect(res.status).toBe(200);
    expect(res.body.days).toBe(9);
    expect(res.body.commonPeriod).toEqual({ from: '2024-01-01', to: '2024-01-10' });
    expect(res.body.bias).toBeCloseTo(-7.15, 6);
    expect(res.body.correlation).toBeCloseTo(1, 4);
    expect(res.body.second).toMatchObject({ stationName: 'Upper moraine mast', network: 'Invented Alpine Survey' });
    expect(res.body.notes.join(' ')).toContain('not merged');
    expect((await agent.get(`/api/catchments/${id}/datasets`)).body.datasets).toHaveLength(2);
  });

  it('refuses records of different variables, naming the field', async () => {
    const id = await newCatchment();
    const a = await storeSeries(agent, id, 'temperature-hourly.csv', { variable: 'temperature' });
    const b = await storeSeries(agent, id, 'precipitation-daily.csv', { variable: 'precipitation' });
    const res = await agent.get(`/api/catchments/${id}/stations/compare`).query({ first: a.id, second: b.id });
    expect(res.status).toBe(422);
    expect(res.body.error.field).toBe('second');
  });
});

describe('tenant isolation and roles', () => {
  it('hides one organisation’s stations from another (404), and lets scientists read but not write', async () => {
    const id = await newCatchment();
    const upper = (await agent.post(`/api/catchments/${id}/stations`).send(station())).body.station;
    const foreign = await signedInAgent(t.app, other.users.admin.email);
    expect((await foreign.get(`/api/catchments/${id}/stations`)).status).toBe(404);
    expect((await foreign.put(`/api/catchments/${id}/stations/${upper.id}`).send(station())).status).toBe(404);
    expect((await foreign.delete(`/api/catchments/${id}/stations/${upper.id}`)).status).toBe(404);
    const otherCatchment = (await foreign.post('/api/catchments').send(catchmentFields())).body.catchment.id;
    expect((await foreign.get(`/api/catchments/${otherCatchment}/stations`)).body.stations).toHaveLength(1);
    expect((await agent.put(`/api/catchments/${otherCatchment}/stations/${upper.id}`).send(station())).status).toBe(404);
    const scientist = await signedInAgent(t.app, org.users.scientist.email);
    expect((await scientist.get(`/api/catchments/${id}/stations`)).status).toBe(200);
    expect((await scientist.post(`/api/catchments/${id}/stations`).send(station({ name: 'Another' }))).status).toBe(403);
  });
});
