import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import { DEMO_BANDS } from '../../seeds/data/demo-catchment';
import { createOrganisation, signedInAgent, type TestOrg } from '../support/factories';
import { createCatchment, giveActivePlan, inventedValleyInputs, SEASON, waitForRun } from '../support/runs';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let org: TestOrg;
let consultant: TestAgent;
let catchmentId: number;

beforeAll(async () => {
  t = createTestApp({}, { catchmentInputs: inventedValleyInputs });
  org = await createOrganisation(t.db);
  await giveActivePlan(t.db, org.organisationId);
  consultant = await signedInAgent(t.app, org.users.consultant.email);
  catchmentId = await createCatchment(consultant);
  const baseline = (await consultant.get(`/api/catchments/${catchmentId}/scenarios`)).body.scenarios[0].id;
  await consultant.patch(`/api/catchments/${catchmentId}/scenarios/${baseline}`).send({ changes: { period: SEASON } }).expect(200);
});
afterAll(() => t.close());

async function runVariant(name: string, changes: object): Promise<number> {
  const scenario = (await consultant.post(`/api/catchments/${catchmentId}/scenarios`).send({ name, changes: { period: SEASON, ...changes } })).body.scenario.id;
  const { run } = (await consultant.post(`/api/catchments/${catchmentId}/runs`).send({ scenarioId: scenario }).expect(202)).body;
  await waitForRun(consultant, catchmentId, run.id);
  return run.id as number;
}

describe('band tables as versions', () => {
  it('keeps every saved table; each run points to the version it was made with', async () => {
    await consultant.put(`/api/catchments/${catchmentId}/bands`).send({ bands: DEMO_BANDS }).expect(200);
    const first = await runVariant('Soot', { blackCarbonSnowNgG: 300 });
    const edited = DEMO_BANDS.map((b) => ({ ...b, debrisThicknessM: b.debrisFraction > 0 ? 0.3 : 0 }));
    await consultant.put(`/api/catchments/${catchmentId}/bands`).send({ bands: edited }).expect(200);
    const second = await runVariant('Dust', { dustSnowUgG: 40 });

    const versions = (await consultant.get(`/api/catchments/${catchmentId}/bands/versions`).expect(200)).body.versions;
    expect(versions.map((v: { version: number; bandCount: number }) => [v.version, v.bandCount])).toEqual([[2, DEMO_BANDS.length], [1, DEMO_BANDS.length]]);
    const table = async (runId: number) => (await t.db('runs').where('id', runId).first('band_table_id')).band_table_id;
    expect(await table(first)).toBe(versions[1].id);
    expect(await table(second)).toBe(versions[0].id);
    // the first run's table is still there, as it was
    const kept = await t.db('elevation_bands').where('band_table_id', versions[1].id).orderBy('position').select('debris_thickness_m');
    expect(kept.map((r: { debris_thickness_m: number }) => r.debris_thickness_m)).toEqual(DEMO_BANDS.map((b) => b.debrisThicknessM));
    expect((await consultant.get(`/api/catchments/${catchmentId}/bands`)).body.bands[10].debrisThicknessM).toBe(edited[10].debrisThicknessM);
    // the catchment counts the bands of the table in use only
    expect((await consultant.get(`/api/catchments/${catchmentId}`)).body.catchment.bandCount).toBe(DEMO_BANDS.length);
  }, 120_000);

  it('accepts response units sharing the range of a band, each with its own aspect class, and refuses a repeated class', async () => {
    const [low, high] = DEMO_BANDS;
    const units = [{ ...low, areaKm2: 0.6, aspectClass: 'N' }, { ...low, areaKm2: 0.52, aspectClass: 'S' }, high];
    const saved = await consultant.put(`/api/catchments/${catchmentId}/bands`).send({ bands: units }).expect(200);
    expect(saved.body.bands.map((b: { aspectClass?: string }) => b.aspectClass ?? null)).toEqual(['N', 'S', null]);
    const twice = await consultant.put(`/api/catchments/${catchmentId}/bands`).send({ bands: [units[0], { ...units[1], aspectClass: 'N' }, high] });
    expect(twice.status).toBe(422);
    expect(twice.body.error.message).toMatch(/^Row 2, aspect class: repeats the aspect class N/);
  });
});
