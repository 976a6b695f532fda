import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { catchmentFields } from '../support/catchments';
import { createOrganisation, signedInAgent, type TestOrg } from '../support/factories';
import { createTestApp, type TestApp } from '../support/test-app';
import { fixture, uploadSeries } from '../support/uploads';

let t: TestApp;
let org: TestOrg;
let other: TestOrg;
let agent: Awaited<ReturnType<typeof signedInAgent>>;

beforeAll(async () => {
  t = createTestApp();
  org = await createOrganisation(t.db);
  other = await createOrganisation(t.db);
  agent = await signedInAgent(t.app, org.users.consultant.email);
});
afterAll(() => t.close());

async function newCatchment(): Promise<number> {
  return (await agent.post('/api/catchments').send(catchmentFields())).body.catchment.id;
}

async function storedCounts(catchmentId: number) {
  const [{ datasets }] = await t.db('datasets').where('catchment_id', catchmentId).count({ datasets: '*' });
  const [{ values }] = await t.db('dataset_values').join('datasets', 'datasets.id', 'dataset_values.dataset_id').where('datasets.catchment_id', catchmentId).count({ values: '*' });
  return { datasets: Number(datasets), values: Number(values) };
}

describe('a good hourly temperature file', () => {
  it('previews columns, unit, step and rows, then stores every value on confirm', async () => {
    const id = await newCatchment();
    const preview = await uploadSeries(agent, id, fixture('temperature-hourly.csv'));
    expect(preview.status).toBe(201);
    expect(preview.body).toMatchObject({
      variable: 'temperature', unit: '°C', timeStep: 'hourly', rowCount: 72, valueCount: 72, canConfirm: true,
      first: '2024-01-01 00:00', last: '2024-01-03 23:00', problems: [],
      columns: [{ name: 'time', role: 'time' }, { name: 'temperature_c', role: 'value' }],
    });
    expect(preview.body.unitNote).toContain('taken from the column name');
    expect(preview.body.firstRows).toHaveLength(10);
    expect(await storedCounts(id)).toEqual({ datasets: 0, values: 0 });

    const confirmed = await agent.post(`/api/catchments/${id}/uploads/${preview.body.token}/confirm`);
    expect(confirmed.status).toBe(201);
    expect(confirmed.body.dataset).toMatchObject({ valueCount: 72, completeness: 1, source: 'Test camp logger', accuracy: '±0.2 °C', timeZone: 'Asia/Kolkata' });
    expect(confirmed.body.dataset.uploadedBy).toContain('consultant');
    expect(await storedCounts(id)).toEqual({ datasets: 1, values: 72 });
    // The pending upload is used up: confirming it again says it was stored.
    expect((await agent.post(`/api/catchments/${id}/uploads/${preview.body.token}/confirm`)).status).toBe(409);
  });

  it('reads kelvin when the unit is chosen and says so', async () => {
    const id = await newCatchment();
    const kelvin = Buffer.from('time,temperature\n2024-01-01 00:00,268.15\n2024-01-01 01:00,270.15\n');
    const res = await uploadSeries(agent, id, kelvin, { unit: 'K' });
    expect(res.body.unit).toBe('K');
    expect(res.body.firstRows[0].value).toBeCloseTo(-5, 6);
  });

  it('suggests kelvin when values read as °C are far too warm', async () => {
    const id = await newCatchment();
    const res = await uploadSeries(agent, id, Buffer.from('time,temperature\n2024-01-01 00:00,268.15\n2024-01-01 01:00,270.15\n'));
    expect(res.body.unitNote).toBe('No unit in the column name "temperature"; assumed °C.');
    expect(res.body.problems[0].message).toBe('268.15 °C is outside the plausible range -60 to 50 °C (kelvin? choose K as the unit)');
  });

  it('says which unit it assumed when the header names none', async () => {
    const id = await newCatchment();
    const res = await uploadSeries(agent, id, Buffer.from('date,precipitation\n2024-01-01,1.5\n2024-01-02,0\n'), { variable: 'precipitation' });
    expect(res.body.unitNote).toBe('No unit in the column name "precipitation"; assumed mm.');
    expect(res.body.timeStep).toBe('daily');
  });
});

describe('files with problems', () => {
  it('lists a gap as a range, as a warning, and stores the rest with the gap kept', async () => {
    const id = await newCatchment();
    const res = await uploadSeries(agent, id, fixture('temperature-hourly-gap.csv'));
    expect(res.body.canConfirm).toBe(true);
    expect(res.body.problems).toEqual([{
      kind: 'gap', severity: 'warning', row: 32, column: 'time',
      message: 'no values from 2024-01-02 06:00 to 2024-01-02 11:00 (6 hours); kept as a gap',
    }]);
    const confirmed = await agent.post(`/api/catchments/${id}/uploads/${res.body.token}/confirm`);
    expect(confirmed.body.dataset.completeness).toBeCloseTo(66 / 72, 6);
    const series = await agent.get(`/api/catchments/${id}/datasets/${confirmed.body.dataset.id}/series`);
    expect(series.body.times).toHaveLength(72);
    expect(series.body.values.slice(29, 37).map((v: number | null) => v === null)).toEqual([false, true, true, true, true, true, true, false]);
  });

  it('reads semicolon-separated files with decimal commas and says so', async () => {
    const id = await newCatchment();
    const res = await uploadSeries(agent, id, fixture('semicolon-decimal-comma.csv'));
    expect(res.body).toMatchObject({ delimiter: 'semicolon', decimalComma: true, canConfirm: true, valueCount: 24 });
    expect(res.body.firstRows[0].value).toBe(-8.8);
  });

  it.each([
    ['out-of-order.csv', 'out_of_order', 13, 'time'],
    ['duplicates.csv', 'duplicate', 10, 'time'],
    ['text-in-numbers.csv', 'not_a_number', 7, 'temperature_c'],
    ['formula-injection.csv', 'not_a_number', 5, 'temperature_c'],
    ['implausible.csv', 'implausible', 8, 'temperature_c'],
  ])('flags %s (%s on line %i, column %s) and refuses to store it', async (file, kind, row, column) => {
    const id = await newCatchment();
    const res = await uploadSeries(agent, id, fixture(file));
    expect(res.status).toBe(201);
    expect(res.body.canConfirm).toBe(false);
    expect(res.body.problems).toContainEqual(expect.objectContaining({ kind, row, column, severity: 'error' }));
    const confirmed = await agent.post(`/api/catchments/${id}/uploads/${res.body.token}/confirm`);
    expect(confirmed.status).toBe(422);
    expect(confirmed.body.error.details.problems.length).toBeGreaterThan(0);
    expect(await storedCounts(id)).toEqual({ datasets: 0, values: 0 });
  });

  it('flags a time step that contradicts the chosen one', async () => {
    const id = await newCatchment();
    const res = await uploadSeries(agent, id, fixture('temperature-hourly.csv'), { timeStep: 'daily' });
    expect(res.body.canConfirm).toBe(false);
    expect(res.body.problems[0]).toMatchObject({ kind: 'step_mismatch', row: 0, message: 'you chose daily values but the timestamps are one hour apart' });
  });
});

describe('files refused outright', () => {
  it.each([
    ['a wrong header', fixture('wrong-header.csv'), 'series.csv', 422, 'validation_failed', /Column names not recognised: found "when", "reading"/],
    ['an empty file', fixture('empty.csv'), 'series.csv', 400, 'bad_request', /The file is empty/],
    ['a header without rows', Buffer.from('time,temperature_c\n'), 'series.csv', 422, 'validation_failed', /no data rows/],
    ['a binary file renamed .csv', Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]), Buffer.alloc(200, 7)]), 'photo.csv', 415, 'not_csv', /binary data/],
    ['a spreadsheet file', Buffer.from('PK...'), 'series.xlsx', 415, 'not_csv', /Only CSV files/],
    ['a file over 10 MB', Buffer.alloc(10 * 1024 * 1024 + 10, 'a'), 'big.csv', 413, 'too_large', /larger than the 10 MB limit/],
  ])('refuses %s with a clear message and stores nothing', async (_what, content, fileName, status, code, message) => {
    const id = await newCatchment();
    const res = await uploadSeries(agent, id, content, { fileName });
    expect(res.status).toBe(status);
    expect(res.body.error.code).toBe(code);
    expect(res.body.error.message).toMatch(message);
    expect(await storedCounts(id)).toEqual({ datasets: 0, values: 0 });
    const [{ pending }] = await t.db('pending_uploads').where('catchment_id', id).count({ pending: '*' });
    expect(Number(pending)).toBe(0);
  });

  it('names a missing provenance field', async () => {
    const id = await newCatchment();
    const res = await agent.post(`/api/catchments/${id}/uploads`).field('variable', 'temperature').field('timeZone', 'Asia/Kolkata')
      .attach('file', fixture('temperature-hourly.csv'), { filename: 'a.csv', contentType: 'text/csv' });
    expect(res.status).toBe(422);
    expect(res.body.error.field).toBe('source');
  });
});

describe('pending uploads belong to their organisation', () => {
  it("answers 404 when another organisation confirms or discards someone's preview", async () => {
    const id = await newCatchment();
    const preview = await uploadSeries(agent, id, fixture('temperature-hourly.csv'));
    const stranger = await signedInAgent(t.app, other.users.consultant.email);
    expect((await stranger.post(`/api/catchments/${id}/uploads/${preview.body.token}/confirm`)).status).toBe(404);
    expect((await stranger.delete(`/api/catchments/${id}/uploads/${preview.body.token}`)).status).toBe(404);
    expect((await uploadSeries(stranger, id, fixture('temperature-hourly.csv'))).status).toBe(404);
    expect((await agent.delete(`/api/catchments/${id}/uploads/${preview.body.token}`)).status).toBe(204);
    expect(await storedCounts(id)).toEqual({ datasets: 0, values: 0 });
  });

  it('hides datasets of other organisations', async () => {
    const id = await newCatchment();
    const preview = await uploadSeries(agent, id, fixture('discharge-daily.csv'), { variable: 'discharge' });
    const { dataset } = (await agent.post(`/api/catchments/${id}/uploads/${preview.body.token}/confirm`)).body;
    const stranger = await signedInAgent(t.app, other.users.admin.email);
    for (const suffix of ['series', 'monthly', 'csv', 'readings']) {
      expect((await stranger.get(`/api/catchments/${id}/datasets/${dataset.id}/${suffix}`)).status).toBe(404);
    }
    expect((await stranger.delete(`/api/catchments/${id}/datasets/${dataset.id}`)).status).toBe(404);
    const scientist = await signedInAgent(t.app, org.users.scientist.email);
    expect((await scientist.get(`/api/catchments/${id}/datasets/${dataset.id}/series`)).status).toBe(200);
    expect((await scientist.delete(`/api/catchments/${id}/datasets/${dataset.id}`)).status).toBe(403);
  });
});

describe('an expired preview', () => {
  it('answers 410 and stores nothing', async () => {
    const id = await newCatchment();
    const preview = await uploadSeries(agent, id, fixture('temperature-hourly.csv'));
    await t.db('pending_uploads').where('token', preview.body.token).update({ expires_at: new Date(Date.now() - 60_000) });
    const res = await agent.post(`/api/catchments/${id}/uploads/${preview.body.token}/confirm`);
    expect(res.status).toBe(410);
    expect(res.body.error.message).toContain('expired');
    expect(await storedCounts(id)).toEqual({ datasets: 0, values: 0 });
  });
});

describe('reading stored data back', () => {
  it('summarises months and downloads CSV', async () => {
    const id = await newCatchment();
    const preview = await uploadSeries(agent, id, fixture('precipitation-daily.csv'), { variable: 'precipitation' });
    const { dataset } = (await agent.post(`/api/catchments/${id}/uploads/${preview.body.token}/confirm`)).body;
    const monthly = await agent.get(`/api/catchments/${id}/datasets/${dataset.id}/monthly`);
    const total = fixture('precipitation-daily.csv').toString().trim().split('\n').slice(1).reduce((s, l) => s + Number(l.split(',')[1]), 0);
    expect(monthly.body.months).toEqual([{ month: '2024-01', value: Math.round(total * 100) / 100, statistic: 'total', count: 30, expected: 30, completeness: 1 }]);
    const csv = await agent.get(`/api/catchments/${id}/datasets/${dataset.id}/csv`);
    expect(csv.headers['content-type']).toContain('text/csv');
    // The byte-order mark makes spreadsheet programs read units such as °C as UTF-8.
    expect(csv.text.split('\r\n')[0]).toBe('\uFEFFdate,Precipitation (mm)');
    expect(csv.headers['content-disposition']).toBe(`attachment; filename="precipitation-${dataset.id}.csv"`);
    expect(csv.text.split('\r\n')[1]).toBe('2024-01-01,0');
  });
});

describe('stake readings', () => {
  it('stores point mass balance readings and reads them back by elevation', async () => {
    const id = await newCatchment();
    const preview = await uploadSeries(agent, id, fixture('stakes.csv'), { variable: 'pointBalance' });
    expect(preview.body).toMatchObject({ canConfirm: true, valueCount: 4, unit: 'm w.e.', first: '2023-10-01', last: '2024-09-30' });
    const { dataset } = (await agent.post(`/api/catchments/${id}/uploads/${preview.body.token}/confirm`)).body;
    expect(dataset).toMatchObject({ variable: 'pointBalance', kind: 'observation', valueCount: 4, completeness: 1 });
    const readings = await agent.get(`/api/catchments/${id}/datasets/${dataset.id}/readings`);
    expect(readings.body.readings[0]).toEqual({ stake: 'A1', elevationM: 4050, from: '2023-10-01', to: '2024-09-30', balanceMWe: -2.35 });
    const csv = await agent.get(`/api/catchments/${id}/datasets/${dataset.id}/csv`);
    expect(csv.text.split('\r\n')[1]).toBe('A1,4050,2023-10-01,2024-09-30,-2.35');
  });

  it('lists every bad reading by line and column and stores nothing', async () => {
    const id = await newCatchment();
    const res = await uploadSeries(agent, id, fixture('stakes-bad.csv'), { variable: 'pointBalance' });
    expect(res.body.canConfirm).toBe(false);
    expect(res.body.problems.map((p: { kind: string; row: number; column: string }) => [p.kind, p.row, p.column])).toEqual([
      ['duplicate', 3, 'stake'], ['out_of_order', 4, 'to'], ['not_a_number', 5, 'elevation_m'], ['implausible', 6, 'balance_m_we'],
    ]);
    expect((await agent.post(`/api/catchments/${id}/uploads/${res.body.token}/confirm`)).status).toBe(422);
    expect(await storedCounts(id)).toEqual({ datasets: 0, values: 0 });
  });
});
