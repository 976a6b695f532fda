import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import { regionalResultsSchema, studySchema, type Study } from '../../shared/schemas/studies';
import { createOrganisation, signedInAgent, type TestOrg } from '../support/factories';
import { createTestApp, type TestApp } from '../support/test-app';
import { createCatchment, giveActivePlan, inventedValleyInputs, SEASON } from '../support/runs';

let t: TestApp;
let org: TestOrg;
let consultant: TestAgent;
let catchmentIds: number[];

const SOOT = { period: SEASON, blackCarbonSnowNgG: 300 };
const WARM_SOOT = { period: SEASON, blackCarbonSnowNgG: 300, temperatureDeltaC: 1.5 };

async function waitForStudy(agent: TestAgent, id: number, until: (s: Study) => boolean = (s) => !['waiting', 'running'].includes(s.status)): Promise<Study> {
  const deadline = Date.now() + 120_000;
  for (;;) {
    const res = await agent.get(`/api/studies/${id}`);
    expect(res.status).toBe(200);
    const study = studySchema.parse(res.body.study);
    if (until(study)) return study;
    if (Date.now() > deadline) throw new Error(`study ${id} still ${study.status}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

beforeAll(async () => {
  t = createTestApp({}, { catchmentInputs: inventedValleyInputs });
  org = await createOrganisation(t.db);
  await giveActivePlan(t.db, org.organisationId);
  consultant = await signedInAgent(t.app, org.users.consultant.email);
  catchmentIds = [await createCatchment(consultant), await createCatchment(consultant), await createCatchment(consultant)];
});
afterAll(() => t.close());

describe('regional studies', () => {
  let study: Study;

  it('are made from chosen catchments and scenario templates with values per catchment', async () => {
    const res = await consultant.post('/api/studies').send({
      name: `Region ${Date.now()}`, catchmentIds,
      templates: [
        { name: 'Soot', changes: SOOT, values: [{ catchmentId: catchmentIds[2], blackCarbonSnowNgG: 900 }] },
        { name: 'Warm soot', changes: WARM_SOOT },
      ],
      options: { ensembleSize: 3, ensembleSeed: 11 },
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    study = studySchema.parse(res.body.study);
    expect(study.status).toBe('draft');
    expect(study.catchments.map((c) => c.status)).toEqual(['waiting', 'waiting', 'waiting']);
    expect(study.templates[0].values).toEqual([{ catchmentId: catchmentIds[2], blackCarbonSnowNgG: 900 }]);
  });

  it('refuse a catchment of another organisation, a variant called Baseline and per-catchment values outside the study', async () => {
    const stranger = await createOrganisation(t.db);
    await giveActivePlan(t.db, stranger.organisationId);
    const foreignAgent = await signedInAgent(t.app, stranger.users.consultant.email);
    const foreign = await createCatchment(foreignAgent);
    const base = { name: `Bad ${Date.now()}`, templates: [{ name: 'Soot', changes: SOOT }] };
    expect((await consultant.post('/api/studies').send({ ...base, catchmentIds: [catchmentIds[0], foreign] })).status).toBe(422);
    expect((await consultant.post('/api/studies').send({ ...base, catchmentIds, templates: [{ name: 'baseline', changes: SOOT }] })).body.error.field).toBe('templates.0.name');
    const stray = await consultant.post('/api/studies').send({ ...base, catchmentIds: [catchmentIds[0]], templates: [{ name: 'Soot', changes: SOOT, values: [{ catchmentId: catchmentIds[1], dustSnowUgG: 5 }] }] });
    expect(stray.status).toBe(422);
    expect((await foreignAgent.get(`/api/studies/${study.id}`)).status).toBe(404);
    expect((await foreignAgent.post(`/api/studies/${study.id}/start`)).status).toBe(404);
  });

  it('run every catchment × template through the queue, progress per catchment, and start once', async () => {
    const started = await consultant.post(`/api/studies/${study.id}/start`);
    expect(started.status).toBe(202);
    expect(started.body.study.status).not.toBe('draft');
    expect((await consultant.post(`/api/studies/${study.id}/start`)).status).toBe(409);
    study = await waitForStudy(consultant, study.id);
    expect(study.status).toBe('done');
    expect(study.counts).toEqual({ done: 3, running: 0, waiting: 0, failed: 0, cancelled: 0 });
    expect(study.catchments.every((c) => c.cells.length === 2 && c.cells.every((k) => k.status === 'done' && k.runId !== null))).toBe(true);
    // Nothing failed: nothing to retry.
    expect((await consultant.post(`/api/studies/${study.id}/retry`)).status).toBe(409);
  });

  it('give regional totals equal to the sum of the catchments\' own run results, ranked, with ensemble ranges', async () => {
    const res = await consultant.get(`/api/studies/${study.id}/results`);
    expect(res.status).toBe(200);
    const results = regionalResultsSchema.parse(res.body.results);
    expect(results.complete).toEqual({ done: 3, of: 3 });
    expect(results.step).toBe('month');
    for (const template of results.templates) {
      let volume = 0;
      let discharge = 0;
      for (const c of template.catchments) {
        const run = (await consultant.get(`/api/catchments/${c.catchmentId}/runs/${c.runId}/results`)).body.results;
        expect(c.addedVolumeM3).toBeCloseTo(run.totals.addedVolumeM3, 3);
        expect(c.meanAddedDischargeM3s).toBeCloseTo(run.totals.meanAddedDischargeM3s, 9);
        expect(c.addedVolumeRangeM3!.p5).toBeCloseTo(run.ensemble.totals.addedVolumeM3.p5, 3);
        volume += run.totals.addedVolumeM3;
        discharge += run.totals.meanAddedDischargeM3s;
        // By month, the catchment's months add up to its total.
        expect(c.addedByPeriodM3.reduce((a, b) => a + b, 0)).toBeCloseTo(c.addedVolumeM3, 2);
      }
      expect(template.total.addedVolumeM3).toBeCloseTo(volume, 3);
      expect(template.total.meanAddedDischargeM3s).toBeCloseTo(discharge, 9);
      expect(template.addedByPeriodM3.reduce((a, b) => a + b, 0)).toBeCloseTo(volume, 2);
      expect(template.periods).toEqual(['2022-04', '2022-05', '2022-06', '2022-07', '2022-08', '2022-09']);
      const volumes = template.catchments.map((c) => c.addedVolumeM3);
      expect(volumes).toEqual([...volumes].sort((a, b) => b - a));
      expect(template.catchments.map((c) => c.rank)).toEqual([1, 2, 3]);
      const range = template.total.addedVolumeRangeM3!;
      expect(range.p5).toBeLessThanOrEqual(range.p50);
      expect(range.p50).toBeLessThanOrEqual(range.p95);
    }
    // The catchment given more soot in the "Soot" template adds the most of the three identical valleys.
    expect(results.templates[0].catchments[0].catchmentId).toBe(catchmentIds[2]);
    expect(results.cautions.at(-1)).toMatch(/not routed/);
  });

  it('export the regional table as CSV with the cautions and a regional row per template', async () => {
    const res = await consultant.get(`/api/studies/${study.id}/export/regional.csv`).buffer(true);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    const text = res.text;
    expect(text).toMatch(/# Caution,/);
    expect(text).toMatch(/Variant,Rank,Catchment,Area \(km²\),Added volume \(m³\)/);
    expect(text.match(/Region \(sum of the catchments\)/g)).toHaveLength(2);
  });

  it('publish their regional result in a briefing section the client reads, with the regional caution', async () => {
    const first = study.catchments[0];
    const created = await consultant.post('/api/briefings').send({ catchmentId: first.catchmentId, title: 'Regional soot', selection: { runIds: [first.cells[0].runId] } });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const id = created.body.briefing.id as number;
    const draft = { title: 'Regional soot', summary: '', selection: { runIds: [first.cells[0].runId] } };
    const noStudy = await consultant.put(`/api/briefings/${id}/draft`).send({ ...draft, sections: [{ kind: 'regional', heading: 'Region', studyId: 999_999_999, contentKey: 'regional-table' }] });
    expect(noStudy.status).toBe(422);
    expect(noStudy.body.error.field).toBe('sections.0.studyId');
    const saved = await consultant.put(`/api/briefings/${id}/draft`).send({ ...draft, sections: [
      { kind: 'regional', heading: 'Added runoff across the region', studyId: study.id, contentKey: 'regional-table' },
      { kind: 'regional', heading: 'By catchment', studyId: study.id, contentKey: 'regional-by-catchment' },
    ] });
    expect(saved.status, JSON.stringify(saved.body)).toBe(200);
    expect((await consultant.post(`/api/briefings/${id}/publish`)).status).toBe(201);
    await consultant.post(`/api/briefings/${id}/shares`).send({ emails: [org.users.client.email] });
    const client = await signedInAgent(t.app, org.users.client.email);
    const reading = await client.get(`/api/briefings/${id}/versions/1`);
    expect(reading.status).toBe(200);
    const [table, chart] = reading.body.snapshot.sections;
    expect(table.kind).toBe('table');
    expect(table.table.rows.at(-1)[0]).toBe('Region (sum of the catchments)');
    const results = regionalResultsSchema.parse((await consultant.get(`/api/studies/${study.id}/results`)).body.results);
    // Four significant digits in the briefing.
    expect(table.table.rows.at(-1)[1]).toBeCloseTo(results.templates[0].total.addedVolumeM3 / 1e6, 1);
    expect(chart.kind).toBe('chart');
    expect(chart.chart.series).toHaveLength(2);
    expect(reading.body.snapshot.cautions.at(-1)).toMatch(/not routed/);
  });

  it('retry only the catchments that failed or were cancelled', async () => {
    const res = await consultant.post('/api/studies').send({
      name: `Retry ${Date.now()}`, catchmentIds: catchmentIds.slice(0, 2), templates: [{ name: 'Dusty', changes: { period: SEASON, dustSnowUgG: 80 } }],
      options: { ensembleSize: 40 },
    });
    const id = res.body.study.id as number;
    await consultant.post(`/api/studies/${id}/start`);
    const cancelled = await consultant.post(`/api/studies/${id}/cancel`);
    expect(cancelled.status).toBe(200);
    const after = await waitForStudy(consultant, id);
    expect(after.status).toBe('cancelled');
    const before = after.catchments.map((c) => c.cells[0].runId);
    // Cancel leaves none of the study's jobs waiting or running.
    await expect.poll(async () => (await t.ctx.queues.simulations.getJobs(['waiting', 'prioritized', 'active', 'delayed']))
      .filter((j) => before.includes(j.data.runId)).length, { timeout: 10_000 }).toBe(0);
    const retried = await consultant.post(`/api/studies/${id}/retry`);
    expect(retried.status).toBe(202);
    const again = studySchema.parse(retried.body.study);
    expect(again.catchments.map((c) => c.cells[0].runId)).not.toEqual(before);
    await consultant.post(`/api/studies/${id}/cancel`);
  });

  it('make catchments in bulk from one table, naming the row and column of a bad value and storing nothing then', async () => {
    const created = await consultant.post('/api/studies').send({ name: `Table ${Date.now()}`, catchmentIds: [catchmentIds[0]], templates: [{ name: 'Soot', changes: SOOT }] });
    const id = created.body.study.id as number;
    const row = (name: string, lowerM: number, areaKm2: number | string) => ({
      name, latitudeDeg: 46.4, longitudeDeg: 9.9, timeZone: 'Europe/Zurich', stationName: 'Valley station', stationElevationM: 2100,
      lowerM, upperM: lowerM + 200, areaKm2, slopeDeg: 20, aspectDeg: 180, glacierFraction: 0.3, debrisFraction: 0.1, debrisThicknessM: 0.2,
    });
    const marker = `Tbl${Date.now()}`;
    const bad = await consultant.post(`/api/studies/${id}/catchment-table`).send({
      climateFromCatchmentId: catchmentIds[0], rows: [row(`${marker} A`, 2400, 3), row(`${marker} A`, 2600, 'lots')],
    });
    expect(bad.status).toBe(422);
    expect(bad.body.error.message).toMatch(/^Row 3, column areaKm2:/);
    expect(await t.db('catchments').where('name', 'like', `${marker}%`).count({ n: '*' }).first()).toEqual({ n: 0 });
    const good = await consultant.post(`/api/studies/${id}/catchment-table`).send({
      climateFromCatchmentId: catchmentIds[0], rows: [row(`${marker} A`, 2400, 3), row(`${marker} A`, 2600, '2.5'), row(`${marker} B`, 2500, 4)],
    });
    expect(good.status, JSON.stringify(good.body)).toBe(201);
    expect(good.body.created.map((c: { name: string }) => c.name)).toEqual([`${marker} A`, `${marker} B`]);
    expect(good.body.study.catchments).toHaveLength(3);
    const bands = await t.db('elevation_bands').where('catchment_id', good.body.created[0].id).count({ n: '*' }).first();
    expect(bands).toEqual({ n: 2 });
  });
});
