import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import { gradientsReplySchema } from '../../shared/schemas/gradients';
import { waterSettingsReplySchema } from '../../shared/schemas/water-settings';
import { closureHistorySchema, waterBalanceClosureSchema } from '../../shared/schemas/water-balance';
import { runResultsReplySchema } from '../../shared/schemas/results';
import { DEMO_TRUTH } from '../../seeds/data/demo-truth';
import { createOrganisation, signedInAgent, type TestOrg } from '../support/factories';
import { createDemoCatchment } from '../support/lab-catchment';
import { waitForJob } from '../support/lab-jobs';
import { grantActivePlan } from '../support/paid-plan';
import { waitForRun } from '../support/runs';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let org: TestOrg;
let other: TestOrg;
let consultant: TestAgent;
let scientist: TestAgent;
let catchmentId: number;
let lonelyId: number;
const water = (id: number) => `/api/catchments/${id}/water`;
const SEASON = { from: '2023-05-01', to: '2023-09-30' };
const BALANCE_YEAR = { from: '2022-10-01', to: '2023-09-30' };

beforeAll(async () => {
  t = createTestApp({ WORKER_THREADS: '2' });
  org = await createOrganisation(t.db);
  other = await createOrganisation(t.db);
  await grantActivePlan(t.db, org.organisationId);
  consultant = await signedInAgent(t.app, org.users.consultant.email);
  scientist = await signedInAgent(t.app, org.users.scientist.email);
  catchmentId = await createDemoCatchment(t.db, org.organisationId, { withStations: true });
  lonelyId = await createDemoCatchment(t.db, org.organisationId, { withDischarge: false });
});
afterAll(() => t.close());

describe('the water settings of a catchment', () => {
  it('start as the model was before them: nothing fitted, moved or routed', async () => {
    const res = await consultant.get(water(catchmentId));
    expect(res.status).toBe(200);
    const { settings, updatedAt } = waterSettingsReplySchema.parse(res.body);
    expect(settings).toMatchObject({ gradients: { use: false }, redistribution: { avalanche: null, windDrift: null }, routing: null });
    expect(updatedAt).toBeNull();
  });

  it('refuse per-band settings that do not fit the bands, naming the field, and keep what was saved', async () => {
    const wrong = await consultant.put(water(catchmentId)).send({ redistribution: { windDrift: { factors: [1, 1.2] } } });
    expect(wrong.status).toBe(422);
    expect(wrong.body.error.field).toBe('redistribution.windDrift.factors');
    expect(wrong.body.error.message).toMatch(/2 accumulation factor\(s\) for 21 bands/);
    const range = await consultant.put(water(catchmentId)).send({ routing: { parameters: { iceStorageHours: 500 } } });
    expect(range.status).toBe(422);
    expect(range.body.error.field).toBe('routing.parameters.iceStorageHours');
    const peak = await consultant.put(water(catchmentId)).send({ gradients: { use: true, precipitationForm: 'peaked', fixed: { peakElevationM: 7900 } } });
    expect(peak.status).toBe(422);
    expect(peak.body.error.field).toMatch(/^gradients\.fixed/);
    expect((await consultant.get(water(catchmentId))).body.updatedAt).toBeNull();
  });

  it('are read by scientists, written by consultants only, and invisible to other organisations', async () => {
    expect((await scientist.get(water(catchmentId))).status).toBe(200);
    expect((await scientist.put(water(catchmentId)).send({})).status).toBe(403);
    const outsider = await signedInAgent(t.app, other.users.consultant.email);
    expect((await outsider.get(water(catchmentId))).status).toBe(404);
    expect((await outsider.get(`${water(catchmentId)}/gradients`)).status).toBe(404);
    expect((await outsider.put(water(catchmentId)).send({})).status).toBe(404);
  });
});

describe('vertical gradients from the stations', () => {
  it('fit the lapse rate and the precipitation gradient the demo stations were made with (seeds/data/demo-stations.ts)', async () => {
    const res = await consultant.get(`${water(catchmentId)}/gradients`);
    expect(res.status).toBe(200);
    const g = gradientsReplySchema.parse(res.body);
    expect(g.stations).toHaveLength(4);
    // Each month: the made-with −5.8 °C/km within three standard errors plus 0.3 °C/km of daily noise left in a two-year mean.
    for (const m of g.lapseRates) {
      expect(m.status).toBe('fitted');
      expect(Math.abs(m.lapseRateKPerKm - DEMO_TRUTH.parameters.lapseRateCPerKm!)).toBeLessThan(3 * (m.standardErrorKPerKm ?? 0) + 0.3);
    }
    const annual = g.precipitationFits[0];
    expect(annual.profile.kind).toBe('linear');
    if (annual.profile.kind === 'linear') expect(annual.profile.gradientPerKm).toBeGreaterThan(0.35);
    if (annual.profile.kind === 'linear') expect(annual.profile.gradientPerKm).toBeLessThan(0.65);
    expect(g.periods.temperature).toEqual({ from: '2022-10-01', to: '2024-09-30' });
    expect(g.bandClimate.temperatureOffsetK).toHaveLength(21 * 12);
  });

  it('say the gradient is assumed, not fitted, with one station', async () => {
    const g = gradientsReplySchema.parse((await consultant.get(`${water(lonelyId)}/gradients`)).body);
    expect(g.lapseRates.every((m) => m.status === 'assumed')).toBe(true);
    expect(g.notes.join(' ')).toMatch(/assumed, not fitted/);
  });

  it('refuse a profile with more parameters than stations, naming the fit', async () => {
    const res = await consultant.post(`${water(lonelyId)}/gradients/preview`).send({ precipitationForm: 'peaked' });
    expect(res.status).toBe(422);
    expect(res.body.error.field).toMatch(/^gradients\./);
  });

  it('keep hand-set months and export the fit as CSV', async () => {
    const overrides = { lapseRatesKPerKm: [null, null, null, null, null, null, -4.5, null, null, null, null, null], profiles: Array(12).fill(null) };
    const saved = await consultant.put(water(catchmentId)).send({ gradients: { use: true, overrides } });
    expect(saved.status).toBe(200);
    const g = gradientsReplySchema.parse((await consultant.get(`${water(catchmentId)}/gradients`)).body);
    expect(g.inUse).toBe(true);
    expect(g.chosen.lapseRatesKPerKm[6]).toBe(-4.5);
    expect(g.chosen.lapseRateOrigin[6]).toBe('set by hand');
    const csv = await consultant.get(`${water(catchmentId)}/gradients.csv`);
    expect(csv.status).toBe(200);
    expect(csv.text).toMatch(/Vertical gradients/);
    expect(csv.text).toMatch(/July,-4\.5,Set by hand/);
  });
});

describe('precipitation closed by the water balance', () => {
  let jobId: number;

  it('refuses more unknowns than observations, naming the field', async () => {
    const res = await scientist.post(`/api/lab/catchments/${lonelyId}/water-balance`).send({ period: BALANCE_YEAR, unknowns: ['precipitationFactor'] });
    expect(res.status).toBe(422);
    expect(res.body.error.field).toBe('discharge');
    const many = await scientist.post(`/api/lab/catchments/${catchmentId}/water-balance`).send({ period: BALANCE_YEAR, form: 'peaked', unknowns: ['precipitationFactor', 'peakElevationM', 'gradientBelowPerKm', 'decreaseAbovePerKm'], useStakes: false });
    expect(many.status).toBe(422);
    expect(many.body.error.field).toBe('unknowns');
  });

  it('finds the precipitation that made the demo runoff (1.45 × the station record, demo-truth.ts) within 15 %', async () => {
    await consultant.put(water(catchmentId)).send({ gradients: { use: true } });
    const started = await scientist.post(`/api/lab/catchments/${catchmentId}/water-balance`).send({ period: BALANCE_YEAR, unknowns: ['precipitationFactor'] });
    expect(started.status).toBe(202);
    jobId = started.body.id;
    const job = await waitForJob(scientist, jobId);
    expect(job.status, job.error ?? '').toBe('done');
    const c = waterBalanceClosureSchema.parse(job.result);
    expect(c.closed).toBe(true);
    // The demo runoff was made with 1.45 × the station record on a +50 %/km gradient (demo-truth.ts): over the bands that is
    // this much more than the station precipitation shaped by the stations' fitted gradient.
    const multiplier = (g: number, z: number) => 1 + (g * (z - 3420)) / 1000;
    const fitted = c.station.profile.kind === 'linear' ? c.station.profile.gradientPerKm : Number.NaN;
    const weight = c.bands.reduce((s, b) => s + b.areaKm2 * b.stationPrecipitationMm, 0);
    const truthRatio = c.bands.reduce((s, b) => s + b.areaKm2 * b.stationPrecipitationMm * DEMO_TRUTH.precipitationFactor * multiplier(0.5, b.midM) / multiplier(fitted, b.midM), 0) / weight;
    // Within 15 %: the model closes with monthly lapse rates fitted from two noisy years of four stations, not the truth's one
    // lapse rate, and the stakes carry their own noise (σ 0.1 m w.e.) — the closure answers for its model, not for the truth's.
    expect(Math.abs(c.precipitationRatio.value / truthRatio - 1)).toBeLessThan(0.15);
    expect(c.precipitationRatio.value).toBeGreaterThan(1.3);
    expect(c.observations.bandBalances.length).toBeGreaterThan(0);
    expect(c.bands.every((b) => b.inferredPrecipitationMm > b.stationPrecipitationMm)).toBe(true);
    expect(Math.abs(c.balance.precipitationMm - c.balance.evaporationSublimationMm - c.balance.snowStorageChangeMm - c.balance.iceStorageChangeMm - c.balance.storesChangeMm - c.balance.modelledRunoffMm)).toBeLessThan(1);
  }, 180_000);

  it('is kept as the catchment\'s water-balance precipitation, which scenarios may then take', async () => {
    const baseline = (await consultant.get(`/api/catchments/${catchmentId}/scenarios`)).body.scenarios[0];
    await consultant.patch(`/api/catchments/${catchmentId}/scenarios/${baseline.id}`).send({ changes: { period: SEASON, precipitationSource: 'water-balance' } });
    const refused = await consultant.post(`/api/catchments/${catchmentId}/runs`).send({ scenarioId: baseline.id });
    expect(refused.status).toBe(422);
    expect(refused.body.error.field).toBe('changes.precipitationSource');

    const kept = await scientist.put(`/api/lab/catchments/${catchmentId}/water-balance`).send({ jobId, note: 'hydrological year 2023' });
    expect(kept.status).toBe(201);
    const history = closureHistorySchema.parse((await scientist.get(`/api/lab/catchments/${catchmentId}/water-balance`)).body);
    expect(history.current?.note).toBe('hydrological year 2023');
    const csv = await scientist.get(`/api/lab/catchments/${catchmentId}/water-balance.csv`);
    expect(csv.text).toMatch(/Precipitation closed by the water balance/);

    const started = await consultant.post(`/api/catchments/${catchmentId}/runs`).send({ scenarioId: baseline.id });
    expect(started.status).toBe(202);
    expect((await waitForRun(consultant, catchmentId, started.body.run.id)).status).toBe('done');
    const { results } = runResultsReplySchema.parse((await consultant.get(`/api/catchments/${catchmentId}/runs/${started.body.run.id}/results`)).body);
    expect(results.setUp.waterSide.find((l) => l.label === 'Precipitation')?.value).toMatch(/water-balance precipitation/);
    expect(results.setUp.waterSide.find((l) => l.label === 'Band temperature and precipitation')?.value).toMatch(/From 4 stations/);
    await consultant.patch(`/api/catchments/${catchmentId}/scenarios/${baseline.id}`).send({ changes: { period: SEASON, precipitationSource: null } });
  }, 120_000);

  it('refuses to keep an attempt of another catchment', async () => {
    const res = await scientist.put(`/api/lab/catchments/${lonelyId}/water-balance`).send({ jobId });
    expect(res.status).toBe(422);
    expect(res.body.error.field).toBe('jobId');
  });
});

describe('redistribution and routing in a season run', () => {
  it('move snow only between bands, conserving it, and route the discharge that scores the baseline', async () => {
    const settings = { redistribution: { avalanche: {}, windDrift: { factors: Array.from({ length: 21 }, (_, i) => (i > 14 ? 0.7 : i > 8 ? 1.3 : 1)) } }, routing: {} };
    expect((await consultant.put(water(catchmentId)).send(settings)).status).toBe(200);
    const variant = await consultant.post(`/api/catchments/${catchmentId}/scenarios`).send({ name: 'Soot on the water side', changes: { period: SEASON, blackCarbonSnowNgG: 100, blackCarbonIceNgG: 500 } });
    const started = await consultant.post(`/api/catchments/${catchmentId}/runs`).send({ scenarioId: variant.body.scenario.id });
    expect((await waitForRun(consultant, catchmentId, started.body.run.id)).status).toBe('done');
    const { results } = runResultsReplySchema.parse((await consultant.get(`/api/catchments/${catchmentId}/runs/${started.body.run.id}/results`)).body);
    expect(results.outletDischargeM3s).not.toBeNull();
    const moved = results.bandRedistributionMm!.variant;
    const net = moved.reduce((s, b, i) => s + (b.windDrift + b.avalanche) * results.bands[i].areaM2, 0) / results.bands.reduce((s, b) => s + b.areaM2, 0);
    expect(Math.abs(net)).toBeLessThan(1e-6);
    expect(moved.some((b) => b.windDrift !== 0)).toBe(true);
    expect(results.setUp.skill?.routed).toBe(true);
    // Routing delays the water: the outlet's peak comes later than the runoff's and is lower.
    const peakDay = (v: number[]) => v.indexOf(Math.max(...v));
    expect(Math.max(...results.outletDischargeM3s!.variant)).toBeLessThan(Math.max(...results.dischargeM3s.variant));
    expect(peakDay(results.outletDischargeM3s!.variant)).toBeGreaterThanOrEqual(peakDay(results.dischargeM3s.variant));
    expect(results.setUp.waterSide.map((l) => l.value).join(' ')).toMatch(/Linear reservoirs \(Hock & Noetzli 1997\)/);
    const daily = await consultant.get(`/api/catchments/${catchmentId}/runs/${started.body.run.id}/export/daily.csv`);
    expect(daily.text).toMatch(/scenario discharge routed to the outlet \(m³\/s\)/);
    expect(daily.text).toMatch(/# Runoff routing,/);
    const bands = await consultant.get(`/api/catchments/${catchmentId}/runs/${started.body.run.id}/export/bands.csv`);
    expect(bands.text).toMatch(/snow gained \(\+\) or lost \(−\) by avalanching/);
  }, 120_000);
});
