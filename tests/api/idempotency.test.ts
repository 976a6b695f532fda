import { describe, expect, it, vi } from 'vitest';
import { catchmentFields } from '../support/catchments';
import { unique } from '../support/factories';
import { withOrganisation } from '../support/test-org';

const f = withOrganisation();

const catchmentsNamed = async (name: string) => Number((await f.t.db('catchments').where({ organisation_id: f.org.organisationId, name }).count({ n: '*' }))[0]!.n);
/** What mysql2 throws when the database goes away mid-request. */
const connectionLost = () => Object.assign(new Error('Connection lost: The server closed the connection.'), { code: 'PROTOCOL_CONNECTION_LOST', fatal: true });

describe('Idempotency-Key on creates', () => {
  it('answers a retry with the first answer, marked as replayed, and stores once', async () => {
    const fields = catchmentFields();
    const key = unique('key-');
    const first = await f.agent.post('/api/catchments').set('Idempotency-Key', key).send(fields);
    expect(first.status).toBe(201);
    const again = await f.agent.post('/api/catchments').set('Idempotency-Key', key).send(fields);
    expect(again.status).toBe(201);
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect(again.body).toEqual(first.body);
    expect(await catchmentsNamed(fields.name)).toBe(1);
  });

  it('refuses the same key with another request', async () => {
    const key = unique('key-');
    expect((await f.agent.post('/api/catchments').set('Idempotency-Key', key).send(catchmentFields())).status).toBe(201);
    const other = await f.agent.post('/api/catchments').set('Idempotency-Key', key).send(catchmentFields());
    expect(other.status).toBe(422);
    expect(other.body.error.code).toBe('idempotency_key_reused');
  });

  it('stores once when the answer was lost after the write committed: the retry says it was done', async () => {
    const fields = catchmentFields();
    const key = unique('key-');
    // The database goes away between the committed create and reading the new row back.
    const read = vi.spyOn(f.t.ctx.catchments, 'get').mockRejectedValueOnce(connectionLost());
    try {
      const lost = await f.agent.post('/api/catchments').set('Idempotency-Key', key).send(fields);
      expect(lost.status).toBe(503);
      expect(lost.headers['retry-after']).toBeDefined();
    } finally {
      read.mockRestore();
    }
    expect(await catchmentsNamed(fields.name)).toBe(1);
    await vi.waitFor(async () => {
      const retry = await f.agent.post('/api/catchments').set('Idempotency-Key', key).send(fields);
      expect(retry.status).toBe(409);
      expect(retry.body.error.code).toBe('already_applied');
    });
    expect(await catchmentsNamed(fields.name)).toBe(1);
  });

  it('carries a retry out when the first attempt failed before anything was stored', async () => {
    const fields = catchmentFields();
    const key = unique('key-');
    const create = vi.spyOn(f.t.ctx.catchments, 'create').mockRejectedValueOnce(connectionLost());
    try {
      expect((await f.agent.post('/api/catchments').set('Idempotency-Key', key).send(fields)).status).toBe(503);
    } finally {
      create.mockRestore();
    }
    expect(await catchmentsNamed(fields.name)).toBe(0);
    await vi.waitFor(async () => expect((await f.agent.post('/api/catchments').set('Idempotency-Key', key).send(fields)).status).toBe(201));
    expect(await catchmentsNamed(fields.name)).toBe(1);
  });

  it('refuses a malformed key', async () => {
    const res = await f.agent.post('/api/catchments').set('Idempotency-Key', 'short').send(catchmentFields());
    expect(res.status).toBe(400);
  });
});

describe('identical creates at the same moment', () => {
  it('answers eight identical catchment creates with one 201 and seven 409, storing one', async () => {
    const fields = catchmentFields();
    const answers = await Promise.all(Array.from({ length: 8 }, () => f.agent.post('/api/catchments').send(fields)));
    expect(answers.map((a) => a.status).sort()).toEqual([201, 409, 409, 409, 409, 409, 409, 409]);
    expect(answers.every((a) => a.status === 201 || a.body.error.code === 'conflict')).toBe(true);
    expect(await catchmentsNamed(fields.name)).toBe(1);
  });

  it('answers eight identical scenario creates with one 201 and seven 409', async () => {
    const catchment = (await f.agent.post('/api/catchments').send(catchmentFields())).body.catchment.id as number;
    const body = { name: unique('Dusty spring '), changes: { dustSnowUgG: 50 } };
    const answers = await Promise.all(Array.from({ length: 8 }, () => f.agent.post(`/api/catchments/${catchment}/scenarios`).send(body)));
    expect(answers.map((a) => a.status).sort(), JSON.stringify(answers.map((a) => a.body))).toEqual([201, 409, 409, 409, 409, 409, 409, 409]);
  });
});
