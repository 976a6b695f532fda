import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import { transientResultsReplySchema } from '../../shared/schemas/transient-results';
import { DEMO_BANDS } from '../../seeds/data/demo-catchment';
import { demoGlacierAreasKm2 } from '../../seeds/data/demo-stations';
import { createOrganisation, signedInAgent, type TestOrg } from '../support/factories';
import { createDemoCatchment } from '../support/lab-catchment';
import { grantActivePlan } from '../support/paid-plan';
import { waitForRun } from '../support/runs';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let org: TestOrg;
let consultant: TestAgent;
let catchmentId: number;
let variantId: number;
const PATH = { fromYear: 2025, years: 15, warmingLevelC: 3, targetYear: 2060, regionalFactor: 1.5, precipitationChangePercent: 5 };

beforeAll(async () => {
  t = createTestApp({ WORKER_THREADS: '2' });
  org = await createOrganisation(t.db);
  await grantActivePlan(t.db, org.organisationId);
  consultant = await signedInAgent(t.app, org.users.consultant.email);
  catchmentId = await createDemoCatchment(t.db, org.organisationId, { withDischarge: false });
  const glacierKm2 = DEMO_BANDS.reduce((s, b) => s + b.areaKm2 * b.glacierFraction, 0);
  await consultant.put(`/api/catchments/${catchmentId}/water`).send({ glacier: { method: 'volume-area', glacierAreasKm2: demoGlacierAreasKm2(glacierKm2) } });
  const created = await consultant.post(`/api/catchments/${catchmentId}/scenarios`).send({ name: 'Soot', changes: { blackCarbonSnowNgG: 100, blackCarbonIceNgG: 500 } });
  variantId = created.body.scenario.id;
});
afterAll(() => t.close());

describe('a multi-decade run', () => {
  it('refuses what it cannot plan, naming the field, and stores no run', async () => {
    const before = await t.db('runs').where('catchment_id', catchmentId).count({ n: '*' });
    const early = await consultant.post(`/api/catchments/${catchmentId}/runs`).send({ scenarioId: variantId, transient: { ...PATH, fromYear: 2000, targetYear: 2020 } });
    expect(early.status).toBe(422);
    expect(early.body.error.field).toBe('transient.targetYear');
    expect(early.body.error.message).toMatch(/after the record's year \(2023\)/);
    const split = await consultant.post(`/api/catchments/${catchmentId}/runs`).send({ scenarioId: variantId, attribution: true, transient: PATH });
    expect(split.status).toBe(422);
    expect(split.body.error.field).toBe('attribution');
    const short = await consultant.post(`/api/catchments/${catchmentId}/runs`).send({ scenarioId: variantId, transient: { ...PATH, years: 5 } });
    expect(short.body.error.field).toBe('transient.years');
    expect(await t.db('runs').where('catchment_id', catchmentId).count({ n: '*' })).toEqual(before);
  });

  it('shrinks the glacier year by year from its simulated balance, for the baseline and the variant', async () => {
    const started = await consultant.post(`/api/catchments/${catchmentId}/runs`).send({ scenarioId: variantId, transient: PATH });
    expect(started.status).toBe(202);
    expect(started.body.run.transient).toMatchObject(PATH);
    expect(started.body.run.period).toBeNull();
    // Progress moves with the simulated years, not only as each of the two members is stored.
    const seen = new Set<number>();
    let watching = true;
    const watch = (async () => {
      while (watching) {
        seen.add(Number((await t.db('runs').where('id', started.body.run.id).first('progress')).progress));
        await new Promise((r) => setTimeout(r, 50));
      }
    })();
    const run = await waitForRun(consultant, catchmentId, started.body.run.id, 120_000);
    watching = false;
    await watch;
    expect([...seen].some((p) => p > 0 && p < 1 && p !== 0.5), [...seen].join(', ')).toBe(true);
    expect(run.status, run.errorMessage ?? '').toBe('done');
    const res = await consultant.get(`/api/catchments/${catchmentId}/runs/${run.id}/years`);
    expect(res.status).toBe(200);
    const { results } = transientResultsReplySchema.parse(res.body);
    expect(results.years).toEqual(Array.from({ length: 15 }, (_, i) => 2025 + i));
    expect(results.recordYears.slice(0, 4)).toEqual([2022, 2023, 2024, 2022]);
    for (const s of [results.baseline, results.variant]) {
      // Volume change = balance × area × ρw/ρice (900 kg m⁻³), year after year (Δh update, Huss et al. 2010).
      for (let i = 1; i < results.years.length; i++) {
        const expected = (s.massBalanceMm[i - 1] / 1000) * s.glacierAreaKm2[i - 1] * 1e6 * (1000 / 900) / 1e9;
        expect(s.glacierVolumeKm3[i] - s.glacierVolumeKm3[i - 1]).toBeCloseTo(expected, 6);
      }
      expect(s.glacierAreaKm2.at(-1)!).toBeLessThan(s.glacierAreaKm2[0]);
    }
    // Darker ice melts faster: less of it is left at the end.
    expect(results.variant.finalVolumeKm3).toBeLessThan(results.baseline.finalVolumeKm3);
    expect(results.totals.iceDrawnDownKm3).toBeGreaterThan(0);
    expect(results.globalWarmingC[0]).toBeGreaterThan(1.09);
    expect(results.setUp.waterSide.map((l) => l.label)).toEqual(expect.arrayContaining(['Multi-decade run', 'Initial glacier', 'Runoff routing']));
    expect(results.cautions.join(' ')).toMatch(/not as new water/);
    expect((await consultant.get(`/api/catchments/${catchmentId}/runs/${run.id}/results`)).status).toBe(409);

    const csv = await consultant.get(`/api/catchments/${catchmentId}/runs/${run.id}/export/years.csv`);
    expect(csv.status).toBe(200);
    expect(csv.text).toMatch(/# Peak water \(baseline\),/);
    expect(csv.text.split('\r\n').filter((l) => /^20\d\d,/.test(l))).toHaveLength(15);
  }, 180_000);
});
