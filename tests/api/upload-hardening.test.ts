import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { describe, expect, it, vi } from 'vitest';
import { catchmentFields } from '../support/catchments';
import { TEST_PASSWORD } from '../support/factories';
import { withOrganisation } from '../support/test-org';
import { fixture, uploadSeries } from '../support/uploads';

const f = withOrganisation();

const newCatchment = async (): Promise<number> => (await f.agent.post('/api/catchments').send(catchmentFields())).body.catchment.id;
const datasetCount = async (catchmentId: number) => Number((await f.t.db('datasets').where('catchment_id', catchmentId).count({ n: '*' }))[0]!.n);

describe('confirming one preview several times at once', () => {
  it('stores it once: one 201, the other four 409, and the values once', async () => {
    const id = await newCatchment();
    const preview = await uploadSeries(f.agent, id, fixture('temperature-hourly.csv'));
    expect(preview.status).toBe(201);
    const answers = await Promise.all(Array.from({ length: 5 }, () => f.agent.post(`/api/catchments/${id}/uploads/${preview.body.token}/confirm`)));
    const statuses = answers.map((a) => a.status).sort();
    expect(statuses).toEqual([201, 409, 409, 409, 409].sort());
    expect(answers.find((a) => a.status === 409)!.body.error.code).toBe('conflict');
    expect(await datasetCount(id)).toBe(1);
    const [{ n }] = await f.t.db('dataset_values').join('datasets', 'datasets.id', 'dataset_values.dataset_id').where('datasets.catchment_id', id).count({ n: '*' });
    expect(Number(n)).toBe(72);
  });

  it('stores ten previews confirmed five times each as exactly ten datasets', async () => {
    const id = await newCatchment();
    const tokens: string[] = [];
    for (let i = 0; i < 10; i++) tokens.push((await uploadSeries(f.agent, id, fixture('temperature-hourly.csv'))).body.token);
    const answers = await Promise.all(tokens.flatMap((token) => Array.from({ length: 5 }, () => f.agent.post(`/api/catchments/${id}/uploads/${token}/confirm`))));
    expect(answers.filter((a) => a.status === 201)).toHaveLength(10);
    expect(answers.filter((a) => a.status === 409)).toHaveLength(40);
    expect(await datasetCount(id)).toBe(10);
  });
});

describe('reading a file once, off the event loop', () => {
  it('reads the file in a worker thread at preview and never again at confirm', async () => {
    const id = await newCatchment();
    const reads = vi.spyOn(f.t.ctx.uploads.pool, 'run');
    try {
      const preview = await uploadSeries(f.agent, id, fixture('temperature-hourly.csv'));
      expect(reads).toHaveBeenCalledTimes(1);
      expect((await f.agent.post(`/api/catchments/${id}/uploads/${preview.body.token}/confirm`)).status).toBe(201);
      expect(reads).toHaveBeenCalledTimes(1);
    } finally {
      reads.mockRestore();
    }
  });

  it('answers a refusal found in the worker with its own status and message', async () => {
    const id = await newCatchment();
    const binary = await uploadSeries(f.agent, id, Buffer.from([0x74, 0x69, 0x6d, 0x65, 0x00, 0x01]));
    expect(binary.status).toBe(415);
    expect(binary.body.error.code).toBe('not_csv');
  });
});

/** A multipart body written by hand, sent to the preview step. */
const rawUpload = (catchmentId: number, contentType: string, body: string) =>
  f.agent.post(`/api/catchments/${catchmentId}/uploads`).set('Content-Type', contentType).send(body);

describe('malformed multipart bodies', () => {
  const boundary = 'tarnishboundary';
  const part = (headers: string, content: string) => `--${boundary}\r\n${headers}\r\n\r\n${content}\r\n`;
  const filePart = part('Content-Disposition: form-data; name="file"; filename="a.csv"\r\nContent-Type: text/csv', 'time,temperature_c\n2024-01-01 00:00,1');
  const fields = part('Content-Disposition: form-data; name="variable"', 'temperature') + part('Content-Disposition: form-data; name="timeZone"', 'UTC') + part('Content-Disposition: form-data; name="source"', 'Camp');
  const type = `multipart/form-data; boundary=${boundary}`;
  const cases: [string, string, string][] = [
    ['a truncated part', type, `${fields}--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="a.csv"\r\n\r\ntime,temp`],
    ['no closing boundary', type, fields + filePart],
    ['a bad part header', type, `${fields}--${boundary}\r\nContent-Disposition form-data name file\r\n\r\nx\r\n--${boundary}--\r\n`],
    ['the wrong boundary', 'multipart/form-data; boundary=other', `${fields}${filePart}--${boundary}--\r\n`],
    ['an empty body', type, ''],
    ['no boundary at all', 'multipart/form-data', `${fields}${filePart}--${boundary}--\r\n`],
    ['a 100 kB part header', type, `${fields}--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="${'a'.repeat(100_000)}.csv"\r\n\r\nx\r\n--${boundary}--\r\n`],
  ];

  it.each(cases)('answers %s with 400 and a message, storing nothing', async (_label, contentType, body) => {
    const id = await newCatchment();
    const res = await rawUpload(id, contentType, body);
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/upload|file/i);
    expect(await f.t.db('pending_uploads').where('catchment_id', id).count({ n: '*' }).then((r) => Number(r[0]!.n))).toBe(0);
  });
});

describe('uploads in progress per organisation', () => {
  // A geodata upload takes a slot of the same organisation's count as a CSV upload.
  it.each(['uploads', 'geodata/uploads/dem'])('answers one of three uploads to …/%s sent at once with 429 and Retry-After while two are still arriving, and takes uploads again after', async (target) => {
    const id = await newCatchment();
    const server = f.t.app.listen(0, '127.0.0.1');
    await new Promise<void>((resolve) => server.once('listening', () => resolve()));
    const { port } = server.address() as AddressInfo;
    const signIn = await f.agent.post('/api/auth/sign-in').send({ email: f.org.users.consultant.email, password: TEST_PASSWORD });
    const cookie = signIn.headers['set-cookie']![0]!.split(';')[0]!;
    const answers: { status: number; retryAfter?: string; body: string }[] = [];
    // Three uploads whose bodies have only begun to arrive (the rest never comes).
    const slow = Array.from({ length: 3 }, () => {
      const req = http.request({
        host: '127.0.0.1', port, method: 'POST', path: `/api/catchments/${id}/${target}`,
        headers: { Cookie: cookie, 'X-Requested-With': 'tarnish', 'Content-Type': 'multipart/form-data; boundary=slow', 'Content-Length': '100000' },
      });
      req.on('error', () => undefined);
      req.on('response', (res) => {
        let body = '';
        res.on('data', (chunk: Buffer) => (body += chunk.toString()));
        res.on('end', () => answers.push({ status: res.statusCode!, retryAfter: res.headers['retry-after'], body }));
      });
      req.write('--slow\r\nContent-Disposition: form-data; name="variable"\r\n\r\ntemperature\r\n');
      return req;
    });
    try {
      await vi.waitFor(() => expect(answers).toHaveLength(1));
      expect(answers[0]).toMatchObject({ status: 429, retryAfter: '5' });
      expect(JSON.parse(answers[0]!.body).error.code).toBe('too_many_uploads');
    } finally {
      for (const req of slow) req.destroy();
    }
    await vi.waitFor(async () => expect((await uploadSeries(f.agent, id, fixture('temperature-hourly.csv'))).status).toBe(201));
    expect(answers).toHaveLength(1);
    await new Promise<void>((resolve) => server.close(() => resolve()));
  });
});
