import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import { demoGeodataFiles } from '../../seeds/data/demo-geodata';
import { DEMO_TRUTH } from '../../seeds/data/demo-truth';
import { labJobSchema, type LabJob } from '../../shared/schemas/lab';
import { geodeticSkillReplySchema, remoteSensingCalibrationSchema, snowCoverSkillReplySchema } from '../../shared/schemas/lab-remote-sensing';
import { createOrganisation, signedInAgent, type TestOrg } from '../support/factories';
import { createDemoCatchment } from '../support/lab-catchment';
import { grantActivePlan } from '../support/paid-plan';
import { waitForJob } from '../support/lab-jobs';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let org: TestOrg;
let consultant: TestAgent;
let scientist: TestAgent;
let catchmentId: number;

/** The demo valley's geodata on a lab catchment whose climate runs 2021-10-01 to 2023-09-30: the snow maps are dated inside it. */
beforeAll(async () => {
  t = createTestApp();
  org = await createOrganisation(t.db);
  await grantActivePlan(t.db, org.organisationId);
  consultant = await signedInAgent(t.app, org.users.consultant.email);
  scientist = await signedInAgent(t.app, org.users.scientist.email);
  catchmentId = await createDemoCatchment(t.db, org.organisationId);
  for (const f of demoGeodataFiles()) {
    if (f.layer === 'snowCover' && f.fields.observedOn > '2024-09-06') continue;
    const fields = f.layer === 'snowCover' ? { ...f.fields, observedOn: f.fields.observedOn.replace('2024', '2023') } : f.fields;
    const req = consultant.post(`/api/catchments/${catchmentId}/geodata/uploads/${f.layer}`);
    for (const [k, v] of Object.entries(fields)) void req.field(k, v);
    const res = await req.attach('file', Buffer.from(f.bytes), { filename: f.fileName });
    if (res.status !== 201) throw new Error(`${f.layer}: ${res.status} ${JSON.stringify(res.body)}`);
  }
}, 120_000);
afterAll(() => t.close());

describe('remote sensing as calibration targets in the lab', () => {
  it('scores the engine\'s snow cover against the snow-cover maps, band by band and date by date', async () => {
    const res = await scientist.post(`/api/lab/catchments/${catchmentId}/snow-cover-skill`).send({});
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const { comparison } = snowCoverSkillReplySchema.parse(res.body);
    expect(new Set(comparison.pairs.map((p) => p.date))).toEqual(new Set(['2023-04-20', '2023-05-25', '2023-06-28', '2023-08-02', '2023-09-06']));
    expect(comparison.pairs.every((p) => p.simulatedFraction >= 0 && p.simulatedFraction <= 1 && p.validFraction >= 0.3)).toBe(true);
    expect(comparison.scores?.count).toBe(comparison.pairs.length);
    // in April the highest band is snow-covered on the map and in the engine
    const april = comparison.pairs.filter((p) => p.date === '2023-04-20');
    expect(april.at(-1)!.snowCoveredFraction).toBeGreaterThan(0.9);
    expect(april.at(-1)!.simulatedFraction).toBe(1);
  }, 60_000);

  it('scores the simulated balance profile against the geodetic one, saying the record stands for the survey period', async () => {
    const res = await scientist.post(`/api/lab/catchments/${catchmentId}/geodetic-skill`).send({});
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const { comparison } = geodeticSkillReplySchema.parse(res.body);
    expect(comparison.periodsDiffer).toBe(true);
    expect(comparison.period).toEqual({ from: '2021-10-01', to: '2024-09-30' });
    expect(comparison.rows.length).toBeGreaterThan(5);
    const simulated = comparison.rows.map((r) => r.simulatedMwePerYear);
    expect(simulated.at(-1)!).toBeGreaterThan(simulated[0]);
    expect(comparison.withinTwoSigma).toBeGreaterThanOrEqual(0);
  }, 60_000);

  it('finds the demo thinning map in agreement, glacier-wide, with the run of the demo\'s hidden true parameters', async () => {
    const res = await scientist.post(`/api/lab/catchments/${catchmentId}/geodetic-skill`).send({ set: DEMO_TRUTH });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const { glacierWide, rows } = geodeticSkillReplySchema.parse(res.body).comparison;
    expect(glacierWide.sigmaMwePerYear).toBeGreaterThan(0);
    expect(Math.abs(glacierWide.simulatedMwePerYear - glacierWide.observedMwePerYear)).toBeLessThan(Math.min(0.1, 2 * glacierWide.sigmaMwePerYear));
    // ice flow flattens the mapped profile against the surface balance: less loss at the snout than simulated, less gain high up
    expect(rows[0].balanceMwePerYear).toBeGreaterThan(rows[0].simulatedMwePerYear);
    expect(rows.at(-1)!.balanceMwePerYear).toBeLessThan(rows.at(-1)!.simulatedMwePerYear);
  }, 60_000);

  it('calibrates against the geodetic balance as an automatic search target', async () => {
    const started = await scientist.post(`/api/lab/catchments/${catchmentId}/calibrations`)
      .send({ target: 'geodetic', keys: ['iceAlbedo'], period: { from: '2022-10-01', to: '2023-09-30' }, maxEvaluations: 10 });
    expect(started.status, JSON.stringify(started.body)).toBe(202);
    const job: LabJob = await waitForJob(scientist, labJobSchema.parse(started.body).id);
    expect(job.status, job.error ?? '').toBe('done');
    const result = remoteSensingCalibrationSchema.parse(job.result);
    if (result.target !== 'geodetic') throw new Error(`a ${result.target} calibration came back`);
    const misfit = ({ glacierWide: w }: typeof result.start) => Math.abs(w.simulatedMwePerYear - w.observedMwePerYear);
    expect(misfit(result.result)).toBeLessThanOrEqual(misfit(result.start));
  }, 120_000);

  it('answers 404 for another organisation\'s catchment', async () => {
    const other = await createOrganisation(t.db);
    const stranger = await signedInAgent(t.app, other.users.scientist.email);
    await stranger.post(`/api/lab/catchments/${catchmentId}/snow-cover-skill`).send({}).expect(404);
    await stranger.post(`/api/lab/catchments/${catchmentId}/geodetic-skill`).send({}).expect(404);
  });
});
