import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import type { Express } from 'express';
import { createTestApp, type TestApp } from '../support/test-app';
import { createOrganisation, signedInAgent, unique, type TestOrg } from '../support/factories';
import { createDemoCatchment } from '../support/lab-catchment';
import { grantActivePlan } from '../support/paid-plan';
import { waitForRun } from '../support/runs';
import { waitForJob } from '../support/lab-jobs';
import { calibrationHistorySchema, skillReplySchema, stakeSkillReplySchema, surfaceResponseSchema, sweepResultSchema, calibrationResultSchema } from '../../shared/schemas/lab';
import { nse } from '../../shared/melt/index';

let t: TestApp;
let app: Express;
let org: TestOrg;
let other: TestOrg;
let catchmentId: number;
let otherCatchmentId: number;
const season = { from: '2022-06-01', to: '2022-08-31' };
const query = `band=6&from=${season.from}&to=${season.to}`;

beforeAll(async () => {
  t = createTestApp({ WORKER_THREADS: "1" });
  app = t.app;
  org = await createOrganisation(t.db);
  other = await createOrganisation(t.db);
  await grantActivePlan(t.db, org.organisationId);
  catchmentId = await createDemoCatchment(t.db, org.organisationId);
  otherCatchmentId = await createDemoCatchment(t.db, other.organisationId, { withDischarge: false });
});

afterAll(() => t?.close());

/** An automatic calibration is many model runs on the worker process's threads: room for a busy machine. */
const CALIBRATION_TIMEOUT_MS = 120_000;

describe('who reaches the lab', () => {
  it('answers scientists, consultants and admins; refuses clients (403) and strangers (401)', async () => {
    for (const role of ['scientist', 'consultant', 'admin'] as const) {
      const agent = await signedInAgent(app, org.users[role].email);
      const res = await agent.get(`/api/lab/catchments/${catchmentId}/calibration`);
      expect(res.status).toBe(200);
    }
    const client = await signedInAgent(app, org.users.client.email);
    expect((await client.get(`/api/lab/catchments/${catchmentId}/surface-response?${query}`)).status).toBe(403);
    expect((await client.post(`/api/lab/catchments/${catchmentId}/sweeps`).send({})).status).toBe(403);
    const { default: request } = await import('supertest');
    expect((await request(app).get(`/api/lab/catchments/${catchmentId}/calibration`)).status).toBe(401);
  });
  it('hides other organisations\' catchments and jobs (404)', async () => {
    const scientist = await signedInAgent(app, org.users.scientist.email);
    expect((await scientist.get(`/api/lab/catchments/${otherCatchmentId}/surface-response?${query}`)).status).toBe(404);
    expect((await scientist.get(`/api/lab/catchments/${otherCatchmentId}/calibration`)).status).toBe(404);
    expect((await scientist.put(`/api/lab/catchments/${otherCatchmentId}/calibration`).send({ period: season, set: {} })).status).toBe(404);
    expect((await scientist.post(`/api/lab/catchments/${otherCatchmentId}/sweeps`).send({ period: season, axes: [{ variable: 'temperatureDeltaC', from: 0, to: 1, steps: 2 }] })).status).toBe(404);
    const outsider = await signedInAgent(app, other.users.scientist.email);
    const started = await scientist.post(`/api/lab/catchments/${catchmentId}/sweeps`).send({ period: season, axes: [{ variable: 'temperatureDeltaC', from: 0, to: 1, steps: 2 }] });
    expect(started.status).toBe(202);
    expect((await outsider.get(`/api/lab/jobs/${started.body.id}`)).status).toBe(404);
    expect((await outsider.post(`/api/lab/jobs/${started.body.id}/cancel`)).status).toBe(404);
    await waitForJob(scientist, started.body.id);
  });
});

describe('surface response on the demo climate', () => {
  it('gives the Østrem curve above clean ice under thin debris and far below it at 0.5 m', async () => {
    const scientist = await signedInAgent(app, org.users.scientist.email);
    const res = await scientist.get(`/api/lab/catchments/${catchmentId}/surface-response?${query}`);
    expect(res.status).toBe(200);
    const body = surfaceResponseSchema.parse(res.body);
    const { present } = body.ostrem;
    expect(present.peak.meltMm).toBeGreaterThan(present.cleanIceMeltMm);
    const half = present.points.find((p) => p.thicknessM >= 0.5)!;
    expect(half.meltMm).toBeLessThan(present.cleanIceMeltMm / 3);
    expect(present.criticalThicknessM).toBeGreaterThan(present.peak.thicknessM);
    expect(body.ostrem.warmer.map((c) => c.temperatureDeltaC)).toEqual([1, 2, 3]);
    expect(body.impurity.map((c) => c.surface)).toEqual(['freshSnow', 'oldSnow', 'bareIce']);
    expect(body.band.debrisThicknessM).toBeGreaterThan(0.3);
    expect(body.warming.bandDebris!.perC).toBeLessThan(body.warming.cleanIcePerC);
  });
  it('names a band that does not exist and a period outside the record', async () => {
    const scientist = await signedInAgent(app, org.users.scientist.email);
    const missing = await scientist.get(`/api/lab/catchments/${catchmentId}/surface-response?band=40&from=${season.from}&to=${season.to}`);
    expect(missing.status).toBe(422);
    expect(missing.body.error.message).toMatch(/Band 40 does not exist; the catchment has 21 band/);
    const early = await scientist.get(`/api/lab/catchments/${catchmentId}/surface-response?band=6&from=2020-06-01&to=2020-08-31`);
    expect(early.status).toBe(422);
    expect(early.body.error.message).toMatch(/before the climate record begins \(2021-10-01\)/);
  });
});

describe('skill scores and saved calibration', () => {
  it('scores the baseline against the stored discharge, and the scores can be recomputed from the series', async () => {
    const scientist = await signedInAgent(app, org.users.scientist.email);
    const res = await scientist.post(`/api/lab/catchments/${catchmentId}/skill`).send({ period: season });
    expect(res.status).toBe(200);
    const { evaluation } = skillReplySchema.parse(res.body);
    expect(evaluation.series.dates).toHaveLength(92);
    expect(evaluation.daily.nse).toBeCloseTo(nse(evaluation.series.observed, evaluation.series.simulated), 10);
    expect(evaluation.monthly!.count).toBe(3);
  });
  it('saves an adjusted set with who saved it and the scores then, and new scenarios read it', async () => {
    const scientist = await signedInAgent(app, org.users.scientist.email);
    const set = { parameters: { lapseRateCPerKm: -5.5, temperatureRangeRadiationCoefficient: 0.17 }, precipitationFactor: 1.2 };
    const saved = await scientist.put(`/api/lab/catchments/${catchmentId}/calibration`).send({ period: season, set, note: 'hand adjusted' });
    expect(saved.status).toBe(201);
    const history = calibrationHistorySchema.parse((await scientist.get(`/api/lab/catchments/${catchmentId}/calibration`)).body);
    expect(history.current!.set).toEqual(set);
    expect(history.current!.savedBy).toMatch(/^scientist /);
    expect(history.current!.scores.daily.count).toBe(92);
    const direct = await scientist.post(`/api/lab/catchments/${catchmentId}/skill`).send({ period: season, set });
    expect(history.current!.scores.daily.kge).toBeCloseTo(direct.body.evaluation.daily.kge, 10);
    const { TenantScope } = await import('../../server/services/tenant-scope');
    expect(await t.ctx.lab.calibratedParameters(new TenantScope(t.db, org.organisationId), catchmentId)).toEqual(set);
    await expect(t.ctx.lab.calibratedParameters(new TenantScope(t.db, other.organisationId), catchmentId)).rejects.toMatchObject({ status: 404 });
    // The scenario builder starts new scenarios from this set.
    const consultant = await signedInAgent(app, org.users.consultant.email);
    const setup = await consultant.get(`/api/catchments/${catchmentId}/scenario-setup`);
    expect(setup.status).toBe(200);
    expect(setup.body.calibration).toMatchObject({ ...set, savedBy: history.current!.savedBy });
  });
  it('marks runs on the saved calibration as calibrated and scores their baseline against the stored discharge', async () => {
    const consultant = await signedInAgent(app, org.users.consultant.email);
    const history = calibrationHistorySchema.parse((await consultant.get(`/api/lab/catchments/${catchmentId}/calibration`)).body);
    const { parameters, precipitationFactor } = history.current!.set;
    const scenarios = (await consultant.get(`/api/catchments/${catchmentId}/scenarios`)).body.scenarios;
    const baselineId = scenarios.find((x: { isBaseline: boolean }) => x.isBaseline).id;
    expect((await consultant.patch(`/api/catchments/${catchmentId}/scenarios/${baselineId}`).send({ changes: { period: season, parameters, precipitationFactor } })).status).toBe(200);
    const variant = await consultant.post(`/api/catchments/${catchmentId}/scenarios`).send({ name: unique('Colder air '), changes: { period: season, parameters: { ...parameters, lapseRateCPerKm: -7 }, precipitationFactor, blackCarbonSnowNgG: 100 } });
    const resultsOf = async (scenarioId: number) => {
      const started = await consultant.post(`/api/catchments/${catchmentId}/runs`).send({ scenarioId });
      expect(started.status).toBe(202);
      const run = await waitForRun(consultant, catchmentId, started.body.run.id);
      return (await consultant.get(`/api/catchments/${catchmentId}/runs/${run.id}/results`)).body.results;
    };
    const calibrated = await resultsOf(baselineId);
    expect(calibrated.setUp.calibration).toMatchObject({ status: 'calibrated', message: expect.stringMatching(/^Calibrated: the parameters are the calibration saved on/) });
    expect(calibrated.setUp.skill).toMatchObject({ days: 92, from: season.from, to: season.to, source: 'discharge.csv' });
    expect(calibrated.setUp.skill.kge).toBeCloseTo(history.current!.scores.daily.kge, 6);
    const differing = await resultsOf(variant.body.scenario.id);
    expect(differing.setUp.calibration).toMatchObject({ status: 'differs', message: expect.stringMatching(/temperature lapse rate −7 instead of −5\.5/) });
  });
  it('compares simulated with measured stake balances inside the climate record', async () => {
    const scientist = await signedInAgent(app, org.users.scientist.email);
    const res = await scientist.post(`/api/lab/catchments/${catchmentId}/stake-skill`).send({});
    expect(res.status).toBe(200);
    const { comparison } = stakeSkillReplySchema.parse(res.body);
    // Eight stakes read over the three balance years of the demo record, all inside it.
    expect(comparison.readings).toHaveLength(24);
    expect(comparison.outsideRecord).toBe(0);
    const errors = comparison.readings.map((r) => r.simulatedMWe - r.balanceMWe);
    expect(comparison.meanErrorMWe).toBeCloseTo(errors.reduce((a, e) => a + e, 0) / errors.length, 10);
    expect((await scientist.post(`/api/lab/catchments/${otherCatchmentId}/stake-skill`).send({})).status).toBe(404);
    expect((await scientist.post(`/api/lab/catchments/${otherCatchmentId}/stake-skill`).send({ set: { precipitationFactor: 1.1 } })).status).toBe(404);
    expect((await scientist.post(`/api/lab/catchments/${otherCatchmentId}/skill`).send({ period: season, set: { precipitationFactor: 1.1 } })).status).toBe(404);
  });
  it('refuses a parameter outside its range, naming the field', async () => {
    const scientist = await signedInAgent(app, org.users.scientist.email);
    const res = await scientist.put(`/api/lab/catchments/${catchmentId}/calibration`).send({ period: season, set: { parameters: { temperatureRangeRadiationCoefficient: 1.4 } } });
    expect(res.status).toBe(422);
    expect(res.body.error.field).toBe('set.parameters.temperatureRangeRadiationCoefficient');
  });
});

describe('jobs: sweeps and automatic calibration', () => {
  it('runs a two-parameter sweep with progress to a grid of added melt', async () => {
    const scientist = await signedInAgent(app, org.users.scientist.email);
    const res = await scientist.post(`/api/lab/catchments/${catchmentId}/sweeps`).send({
      period: season, axes: [{ variable: 'temperatureDeltaC', from: 0, to: 2, steps: 3 }, { variable: 'blackCarbonIceNgG', from: 0, to: 1000, steps: 2 }],
    });
    expect(res.status).toBe(202);
    const job = await waitForJob(scientist, res.body.id);
    expect(job.status).toBe('done');
    expect(job.progress).toBe(1);
    const result = sweepResultSchema.parse(job.result);
    expect(result.addedMeltMm).toHaveLength(3);
    expect(result.addedMeltMm[2][1]).toBeGreaterThan(result.addedMeltMm[0][0]);
  });
  it('needs an active seat plan to start a sweep or an automatic calibration (402)', async () => {
    const unpaid = await createOrganisation(t.db);
    const ownCatchment = await createDemoCatchment(t.db, unpaid.organisationId, { withDischarge: false });
    const scientist = await signedInAgent(app, unpaid.users.scientist.email);
    const sweep = await scientist.post(`/api/lab/catchments/${ownCatchment}/sweeps`).send({ period: season, axes: [{ variable: 'temperatureDeltaC', from: 0, to: 1, steps: 2 }] });
    expect(sweep.status).toBe(402);
    expect((await scientist.post(`/api/lab/catchments/${ownCatchment}/calibrations`).send({ keys: ['temperatureRangeRadiationCoefficient'], period: season })).status).toBe(402);
    expect((await scientist.get(`/api/lab/catchments/${ownCatchment}/reference-models?${query}`)).status).toBe(200);
  });
  it('refuses a grid larger than 20 × 20', async () => {
    const scientist = await signedInAgent(app, org.users.scientist.email);
    const res = await scientist.post(`/api/lab/catchments/${catchmentId}/sweeps`).send({ period: season, axes: [{ variable: 'temperatureDeltaC', from: 0, to: 2, steps: 21 }] });
    expect(res.status).toBe(422);
    expect(res.body.error.field).toBe('axes.0.steps');
  });
  it('calibrates as a job and does not lower the KGE; split-sample scores are reported', async () => {
    const scientist = await signedInAgent(app, org.users.scientist.email);
    const res = await scientist.post(`/api/lab/catchments/${catchmentId}/calibrations`).send({
      keys: ['precipitationFactor', 'temperatureRangeRadiationCoefficient'], period: season, validationPeriod: { from: '2023-06-01', to: '2023-07-31' }, maxEvaluations: 12,
    });
    expect(res.status).toBe(202);
    const job = await waitForJob(scientist, res.body.id);
    expect(job.status).toBe('done');
    const result = calibrationResultSchema.parse(job.result);
    if (result.target !== 'discharge') throw new Error('expected a discharge calibration');
    expect(result.scores.daily.kge).toBeGreaterThanOrEqual(result.startScores.daily.kge);
    expect(result.validation!.after.series.dates[0]).toBe('2023-06-01');
    // Each parameter comes with its behavioural range around the value found.
    expect(result.ranges.map((r) => r.key)).toEqual(['precipitationFactor', 'temperatureRangeRadiationCoefficient']);
    for (const r of result.ranges) expect(r.low <= r.best && r.best <= r.high).toBe(true);
    expect(result.atBounds.every((key) => result.keys.includes(key))).toBe(true);
  }, CALIBRATION_TIMEOUT_MS);
  it('calibrates against stake balances, validated on the next balance year', async () => {
    const scientist = await signedInAgent(app, org.users.scientist.email);
    const res = await scientist.post(`/api/lab/catchments/${catchmentId}/calibrations`).send({
      target: 'stakes', keys: ['lapseRateCPerKm'], period: { from: '2021-10-01', to: '2022-09-30' }, validationPeriod: { from: '2022-10-01', to: '2023-09-30' }, maxEvaluations: 10,
    });
    expect(res.status).toBe(202);
    const job = await waitForJob(scientist, res.body.id);
    expect(job.status).toBe('done');
    const result = calibrationResultSchema.parse(job.result);
    if (result.target !== 'stakes') throw new Error('expected a stake calibration');
    expect(result.result.readings).toHaveLength(8);
    expect(result.result.scores!.kge).toBeGreaterThanOrEqual(result.start.scores!.kge);
    expect(result.validation!.after.readings.every((r) => r.from === '2022-10-01')).toBe(true);
  }, CALIBRATION_TIMEOUT_MS);
  it('can be cancelled', async () => {
    const scientist = await signedInAgent(app, org.users.scientist.email);
    const res = await scientist.post(`/api/lab/catchments/${catchmentId}/calibrations`).send({ keys: ['lapseRateCPerKm', 'iceAlbedo', 'temperatureRangeRadiationCoefficient'], period: season, maxEvaluations: 400 });
    expect(res.status).toBe(202);
    const cancelled = await scientist.post(`/api/lab/jobs/${res.body.id}/cancel`);
    expect(cancelled.status).toBe(200);
    expect(cancelled.body.status).toBe('cancelled');
    expect((await scientist.post(`/api/lab/jobs/${res.body.id}/cancel`)).status).toBe(409);
    // The worker stops it and its steps: nothing of it is left in the queues, and the row stays as the cancel wrote it.
    await vi.waitFor(async () => {
      const open = [
        ...await t.ctx.queues.labJobs.getJobs(['waiting', 'prioritized', 'active', 'delayed']),
        ...await t.ctx.queues.lab.getJobs(['waiting', 'prioritized', 'active', 'delayed']),
      ];
      expect(open.filter((j) => j.data.organisationId === org.organisationId)).toEqual([]);
    }, { timeout: 20_000, interval: 100 });
    expect((await scientist.get(`/api/lab/jobs/${res.body.id}`)).body).toMatchObject({ status: 'cancelled', error: 'Cancelled by a member of the organisation.' });
  });
  it('closes a job row that no running process holds when it is cancelled', async () => {
    const scientist = await signedInAgent(app, org.users.scientist.email);
    const [id] = await t.db('lab_jobs').insert({
      organisation_id: org.organisationId, catchment_id: catchmentId, kind: 'sweep', status: 'running', request: '{}', created_by_name: 'gone',
    });
    const res = await scientist.post(`/api/lab/jobs/${id}/cancel`);
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('cancelled');
  });
});
