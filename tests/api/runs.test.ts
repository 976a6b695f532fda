import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import { CAUTIONS, ICE_DARKENING_CAUTION } from '../../shared/text/cautions';
import { SCENARIO_SCHEMA_VERSION } from '../../shared/schemas/scenarios';
import { memberJobId } from '../../server/queue/jobs';
import { createOrganisation, signedInAgent, type TestOrg } from '../support/factories';
import { createTestApp, type TestApp } from '../support/test-app';
import { createCatchment, giveActivePlan, inventedValleyInputs, SEASON, waitForRun } from '../support/runs';
import { queueRun, runEnded, valleyRunInputs } from '../support/queued-runs';

let t: TestApp;
let org: TestOrg;
let other: TestOrg;
let consultant: TestAgent;
let catchmentId: number;
let baselineId: number;

const SOOT = { period: SEASON, blackCarbonSnowNgG: 400, blackCarbonIceNgG: 1500, temperatureDeltaC: 1 };

async function createScenario(agent: TestAgent, name: string, changes: object, id = catchmentId): Promise<number> {
  const res = await agent.post(`/api/catchments/${id}/scenarios`).send({ name, changes });
  expect(res.status).toBe(201);
  return res.body.scenario.id as number;
}

beforeAll(async () => {
  t = createTestApp({}, { catchmentInputs: inventedValleyInputs });
  org = await createOrganisation(t.db);
  other = await createOrganisation(t.db);
  await giveActivePlan(t.db, org.organisationId);
  consultant = await signedInAgent(t.app, org.users.consultant.email);
  catchmentId = await createCatchment(consultant);
  const list = await consultant.get(`/api/catchments/${catchmentId}/scenarios`);
  baselineId = list.body.scenarios[0].id;
  await consultant.patch(`/api/catchments/${catchmentId}/scenarios/${baselineId}`).send({ changes: { period: SEASON } });
});
afterAll(() => t.close());

describe('scenarios', () => {
  it('give every catchment a baseline first', async () => {
    const res = await consultant.get(`/api/catchments/${catchmentId}/scenarios`);
    expect(res.body.scenarios[0]).toMatchObject({ name: 'Baseline', isBaseline: true, archived: false });
  });

  it('are made with the catchment: its baseline exists before anyone lists scenarios', async () => {
    const id = await createCatchment(consultant);
    const rows = await t.db('scenarios').where({ catchment_id: id }).select('name', 'is_baseline');
    expect(rows).toEqual([{ name: 'Baseline', is_baseline: 1 }]);
  });

  it("keep the baseline's name for the baseline, so listing and running never trip over a variant called that", async () => {
    const id = await createCatchment(consultant);
    for (const name of ['Baseline', ' baseline ', 'BASELINE']) {
      const res = await consultant.post(`/api/catchments/${id}/scenarios`).send({ name, changes: {} });
      expect(res.status, name).toBe(422);
      expect(res.body.error.field).toBe('name');
    }
    const variant = await createScenario(consultant, 'Darker', { ...SOOT, period: SEASON }, id);
    const rename = await consultant.patch(`/api/catchments/${id}/scenarios/${variant}`).send({ name: 'Baseline' });
    expect(rename.status).toBe(422);
    const listed = await consultant.get(`/api/catchments/${id}/scenarios`);
    expect(listed.status).toBe(200);
    expect(listed.body.scenarios.map((s: { name: string; isBaseline: boolean }) => [s.name, s.isBaseline])).toEqual([['Baseline', true], ['Darker', false]]);
    const started = await consultant.post(`/api/catchments/${id}/runs`).send({ scenarioId: variant });
    expect(started.status).toBe(202);
    expect((await waitForRun(consultant, id, started.body.run.id)).status).toBe('done');
  });

  it('refuse invalid changes naming the field and the allowed range', async () => {
    const res = await consultant.post(`/api/catchments/${catchmentId}/scenarios`).send({ name: 'Bad', changes: { dustSnowUgG: 9000 } });
    expect(res.status).toBe(422);
    expect(res.body.error).toMatchObject({ field: 'changes.dustSnowUgG', message: 'Dust in snow: must be at most 5000 µg/g' });
    const months = await consultant.post(`/api/catchments/${catchmentId}/scenarios`).send({ name: 'Bad', changes: { temperatureDeltaC: [1, 2] } });
    expect(months.status).toBe(422);
    expect(months.body.error.message).toMatch(/12 monthly values/);
  });

  it('are duplicated, renamed and archived; names stay unique per catchment', async () => {
    const id = await createScenario(consultant, 'Dusty spring', { dustSnowUgG: 80 });
    const copy = await consultant.post(`/api/catchments/${catchmentId}/scenarios/${id}/duplicate`);
    expect(copy.body.scenario).toMatchObject({ name: 'Dusty spring (copy)', isBaseline: false, changes: { dustSnowUgG: 80, schemaVersion: SCENARIO_SCHEMA_VERSION } });
    const clash = await consultant.patch(`/api/catchments/${catchmentId}/scenarios/${copy.body.scenario.id}`).send({ name: 'Dusty spring' });
    expect(clash.status).toBe(409);
    const archived = await consultant.patch(`/api/catchments/${catchmentId}/scenarios/${copy.body.scenario.id}`).send({ name: 'Dusty spring, old', archived: true });
    expect(archived.body.scenario).toMatchObject({ name: 'Dusty spring, old', archived: true });
    const listed = await consultant.get(`/api/catchments/${catchmentId}/scenarios`);
    expect(listed.body.scenarios.map((s: { name: string }) => s.name)).not.toContain('Dusty spring, old');
    const baseline = await consultant.patch(`/api/catchments/${catchmentId}/scenarios/${baselineId}`).send({ archived: true });
    expect(baseline.status).toBe(422);
  });
});

describe('scenario builder support', () => {
  it('hands out the stored inputs for the in-browser preview, at most a year', async () => {
    const res = await consultant.get(`/api/catchments/${catchmentId}/preview-input`).query(SEASON);
    expect(res.status).toBe(200);
    expect(res.body.catchment.bands).toHaveLength(3);
    expect(res.body.forcing.timeStep).toBe('daily');
    const long = await consultant.get(`/api/catchments/${catchmentId}/preview-input`).query({ from: '2021-01-01', to: '2023-01-01' });
    expect(long.status).toBe(422);
    expect(long.body.error.field).toBe('to');
  });
});

describe('roles and organisations', () => {
  it('keep clients out of scenarios, runs and results', async () => {
    const client = await signedInAgent(t.app, org.users.client.email);
    expect((await client.get(`/api/catchments/${catchmentId}/scenarios`)).status).toBe(403);
    expect((await client.post(`/api/catchments/${catchmentId}/scenarios`).send({ name: 'x', changes: {} })).status).toBe(403);
    expect((await client.post(`/api/catchments/${catchmentId}/runs`).send({ scenarioId: baselineId })).status).toBe(403);
    expect((await client.get(`/api/catchments/${catchmentId}/runs`)).status).toBe(403);
  });

  it('let scientists run and read but not write scenarios', async () => {
    const scientist = await signedInAgent(t.app, org.users.scientist.email);
    expect((await scientist.post(`/api/catchments/${catchmentId}/scenarios`).send({ name: 'Mine', changes: {} })).status).toBe(403);
    expect((await scientist.get(`/api/catchments/${catchmentId}/scenarios`)).status).toBe(200);
    const started = await scientist.post(`/api/catchments/${catchmentId}/runs`).send({ scenarioId: baselineId });
    expect([200, 202]).toContain(started.status);
    expect((await waitForRun(scientist, catchmentId, started.body.run.id)).status).toBe('done');
  });

  it("answer 404 for another organisation's catchments, scenarios and runs", async () => {
    const outsider = await signedInAgent(t.app, other.users.consultant.email);
    await giveActivePlan(t.db, other.organisationId);
    expect((await outsider.get(`/api/catchments/${catchmentId}/scenarios`)).status).toBe(404);
    expect((await outsider.get(`/api/catchments/${catchmentId}/scenarios/${baselineId}`)).status).toBe(404);
    expect((await outsider.post(`/api/catchments/${catchmentId}/runs`).send({ scenarioId: baselineId })).status).toBe(404);
    const own = await createCatchment(outsider);
    const foreignScenario = await outsider.post(`/api/catchments/${own}/runs`).send({ scenarioId: baselineId });
    expect(foreignScenario.status).toBe(404);
    const started = await consultant.post(`/api/catchments/${catchmentId}/runs`).send({ scenarioId: baselineId });
    const runId = (await waitForRun(consultant, catchmentId, started.body.run.id)).id;
    for (const path of ['', '/results', '/export/bands.csv', '/export/daily.csv']) {
      expect((await outsider.get(`/api/catchments/${catchmentId}/runs/${runId}${path}`)).status).toBe(404);
    }
    expect((await outsider.post(`/api/catchments/${catchmentId}/runs/${runId}/cancel`)).status).toBe(404);
    // Their own catchment with our run's id is no way in either.
    expect((await outsider.get(`/api/catchments/${own}/runs/${runId}`)).status).toBe(404);
  });

  it('refuse to start runs without an active seat plan', async () => {
    const unpaid = await createOrganisation(t.db);
    const agent = await signedInAgent(t.app, unpaid.users.consultant.email);
    const id = await createCatchment(agent);
    const scenarios = await agent.get(`/api/catchments/${id}/scenarios`);
    const res = await agent.post(`/api/catchments/${id}/runs`).send({ scenarioId: scenarios.body.scenarios[0].id });
    expect(res.status).toBe(402);
  });
});

describe('run lifecycle', () => {
  it('goes queued → running → done, records engine version, input hash and timings, and stores results', async () => {
    const scenarioId = await createScenario(consultant, 'Sooty and warmer', SOOT);
    const started = await consultant.post(`/api/catchments/${catchmentId}/runs`).send({ scenarioId });
    expect(started.status).toBe(202);
    expect(started.body.run).toMatchObject({ status: 'queued', progress: 0, simulationCount: 2, period: SEASON });
    const run = await waitForRun(consultant, catchmentId, started.body.run.id);
    expect(run).toMatchObject({ status: 'done', progress: 1, engineVersion: expect.stringMatching(/^\d+\.\d+\.\d+$/), inputHash: expect.stringMatching(/^[0-9a-f]{64}$/) });
    expect(Date.parse(run.finishedAt!)).toBeGreaterThanOrEqual(Date.parse(run.startedAt!));
    const results = (await consultant.get(`/api/catchments/${catchmentId}/runs/${run.id}/results`)).body.results;
    expect(results.totals.addedVolumeM3).toBeGreaterThan(0);
    expect(results.bands).toHaveLength(3);
    expect(results.months).toEqual(['2022-04', '2022-05', '2022-06', '2022-07', '2022-08', '2022-09']);
    expect(results.dischargeM3s.variant).toHaveLength(183);
    // SOOT darkens bare ice: the sensitivity caution follows the standard ones.
    expect(results.cautions).toEqual([...CAUTIONS, ICE_DARKENING_CAUTION]);
    expect(run.start).toEqual({ method: 'spin-up', years: 1 });
    expect(results.setUp.start).toMatchObject({ label: 'Spun up through the record before the period', adequate: true });
    expect(results.setUp.shortwaveSource).toBe('Clear-sky model with the cloudiness series');
    expect(results.setUp.calibration).toMatchObject({ status: 'uncalibrated', message: expect.stringMatching(/^Not calibrated/) });
    expect(results.setUp.skill).toBeNull();
    expect(results.waterBalance.baseline.runoffMm).toBeGreaterThan(0);
    const stored = await t.db('run_band_months').join('run_members', 'run_members.id', 'run_band_months.member_id').where('run_members.run_id', run.id).count({ n: '*' });
    expect(Number(stored[0].n)).toBe(2 * 3 * 6);
  });

  it('starts as asked: a longer spin-up is a different run, a snow water equivalent needs one value per band', async () => {
    const scenarioId = await createScenario(consultant, 'Sooty, started differently', { ...SOOT, dustSnowUgG: 3 });
    const spun = await consultant.post(`/api/catchments/${catchmentId}/runs`).send({ scenarioId });
    const longer = await consultant.post(`/api/catchments/${catchmentId}/runs`).send({ scenarioId, start: { method: 'spin-up', years: 2 } });
    expect(longer.status).toBe(202);
    expect(longer.body.run.inputHash).not.toBe(spun.body.run.inputHash);
    expect(longer.body.run.start).toEqual({ method: 'spin-up', years: 2 });
    const short = await consultant.post(`/api/catchments/${catchmentId}/runs`).send({ scenarioId, start: { method: 'initial-swe', sweMm: [100, 200] } });
    expect(short.status).toBe(422);
    expect(short.body.error).toMatchObject({ field: 'start.sweMm', message: expect.stringMatching(/one per band \(3\)/) });
    const tooLong = await consultant.post(`/api/catchments/${catchmentId}/runs`).send({ scenarioId, start: { method: 'spin-up', years: 9 } });
    expect(tooLong.status).toBe(422);
    const surveyed = await consultant.post(`/api/catchments/${catchmentId}/runs`).send({ scenarioId, start: { method: 'initial-swe', sweMm: [0, 300, 900] } });
    expect(surveyed.status).toBe(202);
    const done = await waitForRun(consultant, catchmentId, surveyed.body.run.id);
    const results = (await consultant.get(`/api/catchments/${catchmentId}/runs/${done.id}/results`)).body.results;
    expect(results.setUp.start).toMatchObject({ label: 'Started from the snow water equivalent given per band', adequate: true });
    for (const id of [spun.body.run.id, longer.body.run.id]) await waitForRun(consultant, catchmentId, id);
  });

  it('reuses a run with identical inputs instead of computing it again', async () => {
    const scenarioId = await createScenario(consultant, 'Sooty again', SOOT);
    const first = await consultant.post(`/api/catchments/${catchmentId}/runs`).send({ scenarioId });
    await waitForRun(consultant, catchmentId, first.body.run.id);
    const second = await consultant.post(`/api/catchments/${catchmentId}/runs`).send({ scenarioId });
    expect(second.status).toBe(200);
    expect(second.body).toMatchObject({ reused: true, run: { id: first.body.run.id } });
    const changed = await consultant.post(`/api/catchments/${catchmentId}/runs`).send({ scenarioId, ensembleSize: 2 });
    expect(changed.body.reused).toBe(false);
    await waitForRun(consultant, catchmentId, changed.body.run.id);
  });

  it('reuses a run only within its catchment (another catchment with identical data runs its own)', async () => {
    const changes = { ...SOOT, dustIceUgG: 7 };
    const first = await createCatchment(consultant);
    const second = await createCatchment(consultant);
    const a = await consultant.post(`/api/catchments/${first}/runs`).send({ scenarioId: await createScenario(consultant, 'Twin', changes, first) });
    const b = await consultant.post(`/api/catchments/${second}/runs`).send({ scenarioId: await createScenario(consultant, 'Twin', changes, second) });
    expect([a.status, b.status]).toEqual([202, 202]);
    expect(b.body.reused).toBe(false);
    expect(b.body.run.id).not.toBe(a.body.run.id);
    expect((await waitForRun(consultant, second, b.body.run.id)).catchmentId).toBe(second);
    await waitForRun(consultant, first, a.body.run.id);
  });

  it('can be cancelled while it runs', async () => {
    const scenarioId = await createScenario(consultant, 'Long ensemble', { ...SOOT, dustSnowUgG: 30 });
    const started = await consultant.post(`/api/catchments/${catchmentId}/runs`).send({ scenarioId, ensembleSize: 200 });
    expect(started.status).toBe(202);
    const cancelled = await consultant.post(`/api/catchments/${catchmentId}/runs/${started.body.run.id}/cancel`);
    expect(cancelled.status).toBe(200);
    const run = await waitForRun(consultant, catchmentId, started.body.run.id);
    expect(run.status).toBe('cancelled');
    expect((await consultant.get(`/api/catchments/${catchmentId}/runs/${run.id}/results`)).status).toBe(409);
    expect((await consultant.post(`/api/catchments/${catchmentId}/runs/${run.id}/cancel`)).status).toBe(409);
  });

  it('ends failed once, keeping the message, when the worker finds the inputs cannot be simulated (no retry of an input failure)', async () => {
    const inputs = valleyRunInputs({ ensembleSize: 3 });
    // The run service refuses this; stored as it is, only the engine in the worker finds out.
    inputs.stored.catchment.latitudeDeg = 123;
    const runId = await queueRun(t.ctx, org.organisationId, inputs);
    const run = await runEnded(t.ctx, runId);
    expect(run.status).toBe('failed');
    expect(run.error_message).toMatch(/latitude/i);
    // One attempt of the member that failed; the run's other members left the queue without simulating.
    await expect.poll(async () => {
      const jobs = await Promise.all(inputs.plans.map((_, i) => t.ctx.queues.simulations.getJob(memberJobId(runId, i))));
      return jobs.filter((j) => j && j.attemptsStarted > 1).length;
    }).toBe(0);
    const failed = await t.ctx.queues.simulations.getJobs(['failed']);
    const attempts = failed.filter((j) => j.data.runId === runId).map((j) => j.attemptsMade);
    expect(attempts.length).toBeGreaterThan(0);
    expect(attempts.every((n) => n === 1)).toBe(true);
    expect(await t.db('run_members').where('run_id', runId).count({ n: '*' }).first()).toEqual({ n: 0 });
  });

  it('refuses a run whose catchment data are missing, naming what is missing', async () => {
    const plain = createTestApp();
    try {
      const agent = await signedInAgent(plain.app, org.users.consultant.email);
      const id = await createCatchment(agent);
      const scenarios = await agent.get(`/api/catchments/${id}/scenarios`);
      const res = await agent.post(`/api/catchments/${id}/runs`).send({ scenarioId: scenarios.body.scenarios[0].id });
      expect(res.status).toBe(422);
      expect(res.body.error.message).toMatch(/simulation period/);
      await agent.patch(`/api/catchments/${id}/scenarios/${scenarios.body.scenarios[0].id}`).send({ changes: { period: SEASON } });
      const again = await agent.post(`/api/catchments/${id}/runs`).send({ scenarioId: scenarios.body.scenarios[0].id });
      expect(again.status).toBe(422);
      expect(again.body.error.message).toMatch(/elevation bands|precipitation|temperature/);
      const setup = await agent.get(`/api/catchments/${id}/scenario-setup`);
      expect(setup.body).toEqual({ record: null, defaultPeriod: null, calibration: null, background: { blackCarbonSnowNgG: 30, dustSnowUgG: 10 }, waterBalance: null });
    } finally {
      await plain.close();
    }
  });
});

describe('impurities by elevation range', () => {
  it('darken only the bands in the range', async () => {
    const scenarioId = await createScenario(consultant, 'Soot on the upper bands', {
      period: SEASON, impuritiesByElevation: [{ fromM: 3000, toM: 4500, blackCarbonSnowNgG: 800, blackCarbonIceNgG: 2000 }],
    });
    const started = await consultant.post(`/api/catchments/${catchmentId}/runs`).send({ scenarioId, attribution: true });
    expect(started.status).toBe(202);
    expect((await waitForRun(consultant, catchmentId, started.body.run.id)).status).toBe('done');
    const { results } = (await consultant.get(`/api/catchments/${catchmentId}/runs/${started.body.run.id}/results`)).body;
    // Invented valley bands have mean elevations of about 2533, 3200 and 3867 m.
    const added = results.bandAddedMm.map((b: Record<string, number>) => b.snow + b.ice + b.debrisIce + b.rain);
    expect(added[0]).toBeCloseTo(0, 9);
    expect(added[1] + added[2]).toBeGreaterThan(0);
    expect(results.attribution.terms.map((t: { label: string }) => t.label)).toEqual(['Black carbon']);
  });
});

describe('attribution and ensembles', () => {
  it('splits added melt among drivers whose contributions add up to the full change', async () => {
    const scenarioId = await createScenario(consultant, 'Three drivers', { ...SOOT, debrisExtentChange: 0.2 });
    const started = await consultant.post(`/api/catchments/${catchmentId}/runs`).send({ scenarioId, attribution: true });
    expect(started.body.run.simulationCount).toBe(8);
    expect((await waitForRun(consultant, catchmentId, started.body.run.id)).status).toBe('done');
    const { results } = (await consultant.get(`/api/catchments/${catchmentId}/runs/${started.body.run.id}/results`)).body;
    expect(results.attribution.terms.map((term: { label: string }) => term.label)).toEqual([
      'Black carbon', 'Debris', 'Black carbon × Debris', 'Warming', 'Black carbon × Warming', 'Debris × Warming', 'Black carbon × Debris × Warming',
    ]);
    const sum = results.attribution.terms.reduce((a: number, term: { addedVolumeM3: number }) => a + term.addedVolumeM3, 0);
    expect(sum).toBeCloseTo(results.totals.addedVolumeM3, 3);
    expect(results.attribution.fullChangeM3).toBeCloseTo(results.totals.addedVolumeM3, 3);
  });

  it('gives 5–95 % ensemble ranges that bracket the median', async () => {
    const scenarioId = await createScenario(consultant, 'Uncertain soot', { ...SOOT, blackCarbonSnowNgG: 600 });
    const started = await consultant.post(`/api/catchments/${catchmentId}/runs`).send({ scenarioId, ensembleSize: 12, ensembleSeed: 5 });
    expect(started.body.run.simulationCount).toBe(2 + 24);
    expect((await waitForRun(consultant, catchmentId, started.body.run.id)).status).toBe('done');
    const { results } = (await consultant.get(`/api/catchments/${catchmentId}/runs/${started.body.run.id}/results`)).body;
    expect(results.ensemble.size).toBe(12);
    for (const range of Object.values(results.ensemble.totals) as { p5: number; p50: number; p95: number }[]) {
      expect(range.p5).toBeLessThanOrEqual(range.p50);
      expect(range.p50).toBeLessThanOrEqual(range.p95);
    }
    expect(results.ensemble.totals.addedVolumeM3.p95).toBeGreaterThan(results.ensemble.totals.addedVolumeM3.p5);
    const { p5, p50, p95 } = results.ensemble.dischargeM3s;
    p50.forEach((median: number, d: number) => {
      expect(p5[d]).toBeLessThanOrEqual(median);
      expect(median).toBeLessThanOrEqual(p95[d]);
    });
  });
});

describe('exports', () => {
  it('start with catchment, scenario, engine version, input hash and the cautions', async () => {
    const runs = (await consultant.get(`/api/catchments/${catchmentId}/runs`)).body.runs;
    const done = runs.find((r: { status: string; isBaseline: boolean }) => r.status === 'done' && !r.isBaseline);
    for (const file of ['bands.csv', 'daily.csv']) {
      const res = await consultant.get(`/api/catchments/${catchmentId}/runs/${done.id}/export/${file}`);
      expect(res.status).toBe(200);
      expect(res.headers['content-type']).toMatch(/text\/csv/);
      const text = res.text;
      expect(text).toContain(`# Scenario,${done.scenarioName}`);
      expect(text).toContain(`# Input hash,${done.inputHash}`);
      expect(text).toContain(`# Engine version,${done.engineVersion}`);
      for (const caution of CAUTIONS) expect(text).toContain(caution.includes(',') ? `"${caution}"` : caution);
    }
  });
});
