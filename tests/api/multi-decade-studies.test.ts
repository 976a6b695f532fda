import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import { SOURCES } from '../../shared/melt/result';
import { regionalResultsSchema, studySchema, type Study } from '../../shared/schemas/studies';
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
let catchmentIds: number[];
const PATH = { fromYear: 2025, years: 11, warmingLevelC: 2, targetYear: 2050, regionalFactor: 1.5, precipitationChangePercent: 0 };
const YEARS = Array.from({ length: 11 }, (_, i) => String(2025 + i));
const SEASON = { from: '2024-04-01', to: '2024-09-30' };

async function finishedStudy(id: number): Promise<Study> {
  const deadline = Date.now() + 150_000;
  for (;;) {
    const study = studySchema.parse((await consultant.get(`/api/studies/${id}`)).body.study);
    if (!['waiting', 'running'].includes(study.status)) return study;
    if (Date.now() > deadline) throw new Error(`study ${id} still ${study.status}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

beforeAll(async () => {
  t = createTestApp({ WORKER_THREADS: '2' });
  org = await createOrganisation(t.db);
  await grantActivePlan(t.db, org.organisationId);
  consultant = await signedInAgent(t.app, org.users.consultant.email);
  const glacierKm2 = DEMO_BANDS.reduce((s, b) => s + b.areaKm2 * b.glacierFraction, 0);
  catchmentIds = [];
  for (let i = 0; i < 2; i++) {
    const id = await createDemoCatchment(t.db, org.organisationId, { withDischarge: false });
    await consultant.put(`/api/catchments/${id}/water`).send({ glacier: { method: 'volume-area', glacierAreasKm2: demoGlacierAreasKm2(glacierKm2) } });
    catchmentIds.push(id);
  }
});
afterAll(() => t.close());

describe('a multi-decade regional study', () => {
  it('refuses attribution and an ensemble with multi-decade runs, naming the field', async () => {
    const base = { name: `Decades ${Date.now()}`, catchmentIds, templates: [{ name: 'Soot', changes: { blackCarbonSnowNgG: 100 } }] };
    const split = await consultant.post('/api/studies').send({ ...base, options: { transient: PATH, attribution: true } });
    expect(split.status).toBe(422);
    expect(split.body.error.field).toBe('options.attribution');
    const short = await consultant.post('/api/studies').send({ ...base, options: { transient: { ...PATH, years: 5 } } });
    expect(short.body.error.field).toBe('options.transient.years');
  });

  it('adds the catchments up year by year, each year its runs\' own added runoff, and publishes the years to a briefing', async () => {
    const created = await consultant.post('/api/studies').send({
      name: `Decades ${Date.now()}`, catchmentIds,
      // The season is left for a season run of the same variant (the briefing below stands on one); the study runs the years.
      templates: [{ name: 'Soot', changes: { period: SEASON, blackCarbonSnowNgG: 100, blackCarbonIceNgG: 300 }, values: [{ catchmentId: catchmentIds[1], blackCarbonIceNgG: 1500 }] }],
      options: { transient: PATH },
    });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const id = created.body.study.id as number;
    expect(created.body.study.options.transient).toMatchObject(PATH);
    expect((await consultant.post(`/api/studies/${id}/start`)).status).toBe(202);
    const study = await finishedStudy(id);
    expect(study.status, JSON.stringify(study.catchments.map((c) => c.message))).toBe('done');

    const results = regionalResultsSchema.parse((await consultant.get(`/api/studies/${id}/results`)).body.results);
    expect(results.step).toBe('year');
    // The cautions of multi-decade runs come with their regional sum.
    expect(results.cautions.join(' ')).toMatch(/not as new water/);
    expect(results.cautions.at(-1)).toMatch(/not routed/);
    const [template] = results.templates;
    expect(template.periods).toEqual(YEARS);
    const perYear = YEARS.map(() => 0);
    for (const c of template.catchments) {
      // Each catchment's years are its own run's years: scenario runoff minus baseline runoff, every source.
      const own = transientResultsReplySchema.parse((await consultant.get(`/api/catchments/${c.catchmentId}/runs/${c.runId}/years`)).body).results;
      const runoff = (s: typeof own.baseline, i: number) => SOURCES.reduce((a, k) => a + s.runoffM3[k][i], 0);
      own.years.forEach((_, i) => {
        expect(c.addedByPeriodM3[i]).toBeCloseTo(runoff(own.variant, i) - runoff(own.baseline, i), 0);
        perYear[i] += c.addedByPeriodM3[i];
      });
      expect(c.addedVolumeM3).toBeCloseTo(c.addedByPeriodM3.reduce((a, b) => a + b, 0), 0);
      // Mean added discharge over the eleven years of the run.
      expect(c.meanAddedDischargeM3s).toBeCloseTo(c.addedVolumeM3 / (11 * 365.2425 * 86400), 9);
      expect(c.addedVolumeRangeM3).toBeNull();
    }
    template.addedByPeriodM3.forEach((v, i) => expect(v).toBeCloseTo(perYear[i], 0));
    expect(template.total.addedVolumeM3).toBeCloseTo(template.catchments.reduce((a, c) => a + c.addedVolumeM3, 0), 0);
    // The catchment given five times the soot on its ice adds the most.
    expect(template.catchments[0].catchmentId).toBe(catchmentIds[1]);
    expect(template.catchments[0].addedVolumeM3).toBeGreaterThan(template.catchments[1].addedVolumeM3);

    const csv = await consultant.get(`/api/studies/${id}/export/regional.csv`).buffer(true);
    expect(csv.text).toMatch(/# Runs,Multi-decade: added runoff by year/);
    expect(csv.text).toMatch(/Added volume 2025 \(m³\),.*Added volume 2035 \(m³\)/);

    // A briefing compares season runs of its catchment: it stands on a season run of the study's variant and carries the study's years.
    const scenarioId = (await t.db('runs').where('id', study.catchments[0].cells[0].runId!).first('scenario_id')).scenario_id as number;
    const season = await consultant.post(`/api/catchments/${catchmentIds[0]}/runs`).send({ scenarioId });
    expect(season.status, JSON.stringify(season.body)).toBe(202);
    const firstRun = (await waitForRun(consultant, catchmentIds[0], season.body.run.id, 120_000)).id;
    const briefing = await consultant.post('/api/briefings').send({ catchmentId: catchmentIds[0], title: 'Decades of soot', selection: { runIds: [firstRun] } });
    expect(briefing.status, JSON.stringify(briefing.body)).toBe(201);
    const briefingId = briefing.body.briefing.id as number;
    const saved = await consultant.put(`/api/briefings/${briefingId}/draft`).send({
      title: 'Decades of soot', summary: '', selection: { runIds: [firstRun] },
      sections: [{ kind: 'regional', heading: 'Year by year', studyId: id, contentKey: 'regional-by-period' }],
    });
    expect(saved.status, JSON.stringify(saved.body)).toBe(200);
    expect((await consultant.post(`/api/briefings/${briefingId}/publish`)).status).toBe(201);
    const [chart] = (await consultant.get(`/api/briefings/${briefingId}/versions/1`)).body.snapshot.sections;
    expect(chart.chart.xName).toBe('Year');
    expect(chart.chart.categories).toEqual(YEARS);
  }, 200_000);
});
