import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { simulationInputSchema } from '../../shared/melt/schema';
import { BandService } from '../../server/services/catchments/band-service';
import { buildSimulationInputs, requireReadyInputs } from '../../server/services/catchments/simulation-inputs';
import { TenantScope } from '../../server/services/tenant-scope';
import { catchmentFields } from '../support/catchments';
import { createOrganisation, signedInAgent, type TestOrg } from '../support/factories';
import { createTestApp, type TestApp } from '../support/test-app';
import { uploadSeries } from '../support/uploads';

let t: TestApp;
let org: TestOrg;
let agent: Awaited<ReturnType<typeof signedInAgent>>;
let scope: TenantScope;
const bands = new BandService();
const BANDS = [
  { lowerM: 3000, upperM: 3500, areaKm2: 4, slopeDeg: 15, aspectDeg: 180, glacierFraction: 0.3, debrisFraction: 0.6, debrisThicknessM: 0.3 },
  { lowerM: 3500, upperM: 4000, areaKm2: 5, slopeDeg: 20, aspectDeg: 170, glacierFraction: 0.7, debrisFraction: 0.1, debrisThicknessM: 0.05 },
];

beforeAll(async () => {
  t = createTestApp();
  org = await createOrganisation(t.db);
  agent = await signedInAgent(t.app, org.users.consultant.email);
  scope = new TenantScope(t.db, org.organisationId);
});
afterAll(() => t.close());

/** Two days of hourly temperature (hours listed in `skip` left out) and two days of daily precipitation. */
function hourlyCsv(skip: number[] = []): Buffer {
  const lines = ['time,temperature_c'];
  for (let h = 0; h < 48; h++) {
    if (skip.includes(h)) continue;
    lines.push(`2024-07-${String(1 + Math.floor(h / 24)).padStart(2, '0')} ${String(h % 24).padStart(2, '0')}:00,${(2 + h / 10).toFixed(1)}`);
  }
  return Buffer.from(lines.join('\n'));
}

async function store(id: number, content: Buffer, variable: string): Promise<number> {
  const preview = await uploadSeries(agent, id, content, { variable });
  const confirmed = await agent.post(`/api/catchments/${id}/uploads/${preview.body.token}/confirm`);
  expect(confirmed.status).toBe(201);
  return confirmed.body.dataset.id;
}

async function catchmentWith(skipHours: number[]): Promise<number> {
  const id = (await agent.post('/api/catchments').send(catchmentFields())).body.catchment.id;
  await agent.put(`/api/catchments/${id}/bands`).send({ bands: BANDS });
  await store(id, hourlyCsv(skipHours), 'temperature');
  await store(id, Buffer.from('date,precipitation_mm\n2024-07-01,3.5\n2024-07-02,0\n'), 'precipitation');
  return id;
}

describe('building engine inputs from stored data', () => {
  it('assembles catchment and hourly forcing that the engine schema accepts', async () => {
    const id = await catchmentWith([]);
    const built = await buildSimulationInputs(scope, bands, id, { from: '2024-07-01', to: '2024-07-02' });
    expect(built.ready).toBe(true);
    expect(built.missing).toEqual([]);
    expect(built.input.catchment).toMatchObject({ latitudeDeg: 33.2, timeZone: 'Asia/Kolkata', stationElevationM: 3100, bands: BANDS });
    expect(built.input.forcing).toMatchObject({ timeStep: 'hourly', start: '2024-07-01', precipitationStep: 'daily', precipitationMm: [3.5, 0] });
    const forcing = built.input.forcing as { temperatureC: number[] };
    expect(forcing.temperatureC).toHaveLength(48);
    expect(forcing.temperatureC[47]).toBeCloseTo(6.7, 6);
    expect(simulationInputSchema.safeParse(requireReadyInputs(built)).success).toBe(true);
    expect(built.notes).toEqual([]);
  });

  it('notes a dataset kept in another time zone than the catchment', async () => {
    const id = await catchmentWith([]);
    await t.db('datasets').where({ catchment_id: id, variable: 'temperature' }).update({ time_zone: 'UTC' });
    const built = await buildSimulationInputs(scope, bands, id, { from: '2024-07-01', to: '2024-07-02' });
    expect(built.ready).toBe(true);
    expect(built.notes).toEqual([expect.stringMatching(/^Air temperature \(hourly or daily mean\) \(dataset \d+\) is kept in UTC, the catchment in Asia\/Kolkata/)]);
  });

  it('bridges a short gap by interpolation and says so', async () => {
    const id = await catchmentWith([10, 11]);
    const built = await buildSimulationInputs(scope, bands, id, { from: '2024-07-01', to: '2024-07-02' });
    expect(built.ready).toBe(true);
    expect(built.gaps).toEqual([expect.objectContaining({ variable: 'temperature', from: '2024-07-01 10:00', to: '2024-07-01 11:00', steps: 2, bridged: true })]);
    const forcing = built.input.forcing as { temperatureC: number[] };
    expect(forcing.temperatureC[10]).toBeCloseTo(3.0, 6);
  });

  it('reports a gap too long to bridge and one outside the record, and the caller can refuse', async () => {
    const id = await catchmentWith([5, 6, 7, 8, 9, 10, 11, 12]);
    const built = await buildSimulationInputs(scope, bands, id, { from: '2024-07-01', to: '2024-07-03' });
    expect(built.ready).toBe(false);
    expect(built.gaps).toEqual(expect.arrayContaining([
      expect.objectContaining({ variable: 'temperature', from: '2024-07-01 05:00', to: '2024-07-01 12:00', steps: 8, bridged: false }),
      expect.objectContaining({ variable: 'temperature', from: '2024-07-03 00:00', to: '2024-07-03 23:00', bridged: false }),
      expect.objectContaining({ variable: 'precipitation', from: '2024-07-03', to: '2024-07-03', bridged: false }),
    ]));
    expect(() => requireReadyInputs(built)).toThrow(/Air temperature \(hourly or daily mean\) \(dataset \d+\) has no values from 2024-07-01 05:00 to 2024-07-01 12:00/);
  });

  it('builds daily forcing from daily minimum and maximum temperature', async () => {
    const id = (await agent.post('/api/catchments').send(catchmentFields())).body.catchment.id;
    await agent.put(`/api/catchments/${id}/bands`).send({ bands: BANDS });
    await store(id, Buffer.from('date,tmin_c\n2024-07-01,-1.5\n2024-07-02,-0.5\n'), 'temperatureMin');
    await store(id, Buffer.from('date,tmax_c\n2024-07-01,8.5\n2024-07-02,9\n'), 'temperatureMax');
    await store(id, Buffer.from('date,precipitation_mm\n2024-07-01,0\n2024-07-02,12\n'), 'precipitation');
    const built = await buildSimulationInputs(scope, bands, id, { from: '2024-07-01', to: '2024-07-02' });
    expect(built.ready).toBe(true);
    expect(built.input.forcing).toEqual({ timeStep: 'daily', start: '2024-07-01', tMinC: [-1.5, -0.5], tMaxC: [8.5, 9], precipitationMm: [0, 12], precipitationStep: 'daily' });
    expect(simulationInputSchema.safeParse(built.input).success).toBe(true);
  });

  it('names missing bands and datasets', async () => {
    const id = (await agent.post('/api/catchments').send(catchmentFields())).body.catchment.id;
    const built = await buildSimulationInputs(scope, bands, id, { from: '2024-07-01', to: '2024-07-02' });
    expect(built.missing.map((m) => m.variable)).toEqual(['bands', 'precipitation', 'temperature']);
    expect(() => requireReadyInputs(built)).toThrow(/no elevation bands/);
  });

  it("does not reach another organisation's catchment", async () => {
    const id = await catchmentWith([]);
    const other = await createOrganisation(t.db);
    await expect(buildSimulationInputs(new TenantScope(t.db, other.organisationId), bands, id, { from: '2024-07-01', to: '2024-07-02' })).rejects.toThrow(/Catchment not found/);
  });
});
