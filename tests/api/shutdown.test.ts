import http from 'node:http';
import { describe, expect, it, vi } from 'vitest';
import { listenDraining } from '../../server/http-server';
import request from 'supertest';
import { sweepResultSchema } from '../../shared/schemas/lab';
import { TenantScope } from '../../server/services/tenant-scope';
import { signedInAgent, TEST_PASSWORD, unique } from '../support/factories';
import { createDemoCatchment } from '../support/lab-catchment';
import { waitForJob } from '../support/lab-jobs';
import { grantActivePlan } from '../support/paid-plan';
import { createTestApp } from '../support/test-app';
import { withOrganisation } from '../support/test-org';

const f = withOrganisation();

/** A GET over a keep-alive agent, resolving with the status, headers and whether its socket closed afterwards. */
function get(agent: http.Agent, url: string, cookie = '') {
  return new Promise<{ status: number; connection?: string; socketClosed: Promise<void> }>((resolve, reject) => {
    const req = http.get(url, { agent, headers: { Cookie: cookie } }, (res) => {
      res.resume();
      const socketClosed = new Promise<void>((done) => req.socket!.once('close', () => done()));
      res.on('end', () => resolve({ status: res.statusCode!, connection: res.headers.connection, socketClosed }));
    });
    req.on('error', reject);
  });
}

const sessionCookie = async () =>
  (await request(f.t.app).post('/api/auth/sign-in').send({ email: f.org.users.consultant.email, password: TEST_PASSWORD })).headers['set-cookie']![0]!.split(';')[0]!;

/** Rejects if `promise` has not settled within `ms` (the test must never wait on the grace itself). */
const within = <T>(promise: Promise<T>, ms: number) =>
  Promise.race([promise, new Promise<never>((_, reject) => setTimeout(() => reject(new Error(`not done within ${ms} ms`)), ms))]);

describe('graceful shutdown', () => {
  it('closes idle keep-alive connections at once, answers a request in progress with Connection: close, and exits without waiting for the grace', async () => {
    const running = await listenDraining(f.t.app, 0, '127.0.0.1', 60_000);
    const agent = new http.Agent({ keepAlive: true });
    const cookie = await sessionCookie();
    try {
      const idle = await get(agent, `${running.url}/api/health`);
      expect(idle.connection).toBe('keep-alive');

      // A request that is still being answered when the shutdown begins.
      let release!: () => void;
      const held = new Promise<void>((resolve) => (release = resolve));
      const list = f.t.ctx.catchments.list.bind(f.t.ctx.catchments);
      const slow = vi.spyOn(f.t.ctx.catchments, 'list').mockImplementation(async (...args) => {
        await held;
        return list(...args);
      });
      const inProgress = get(new http.Agent({ keepAlive: true }), `${running.url}/api/catchments`, cookie);
      await vi.waitFor(() => expect(slow).toHaveBeenCalled());

      const closing = running.close();
      await within(idle.socketClosed, 2000);
      release();
      const answered = await inProgress;
      expect(answered.connection).toBe('close');
      await within(answered.socketClosed, 2000);
      await within(closing, 2000);
      slow.mockRestore();
    } finally {
      agent.destroy();
    }
  });

  it('cuts a request that outlasts the grace, so the process can always exit', async () => {
    const running = await listenDraining(f.t.app, 0, '127.0.0.1', 200);
    const hang = vi.spyOn(f.t.ctx.catchments, 'list').mockImplementation(() => new Promise(() => undefined));
    const cookie = await sessionCookie();
    try {
      const stuck = get(new http.Agent({ keepAlive: true }), `${running.url}/api/catchments`, cookie).catch((error: Error) => error);
      await vi.waitFor(() => expect(hang).toHaveBeenCalled());
      await within(running.close(), 3000);
      expect(await stuck).toBeInstanceOf(Error);
    } finally {
      hang.mockRestore();
    }
  });
});

describe('runs and lab jobs across a restart of the API', () => {
  it('leaves runs queued and lets a lab sweep started before the restart finish in the workers', async () => {
    const app = createTestApp();
    const organisation_id = f.org.organisationId;
    const scope = new TenantScope(app.db, organisation_id);
    await grantActivePlan(app.db, organisation_id);
    const catchment = await createDemoCatchment(app.db, organisation_id, { withDischarge: false });
    const scenario = (await app.db('scenarios').where({ catchment_id: catchment }).first('id')).id as number;
    // A run lives in the database and the queue, not in the API's memory: a restart leaves it as it is.
    const runId = await scope.insert('runs', {
      catchment_id: catchment, scenario_id: scenario, scenario_name: 'Baseline', is_baseline: true, changes: '{}', status: 'queued',
      engine_version: 'test', input_hash: 'a'.repeat(64),
    });
    const scientist = await signedInAgent(app.app, f.org.users.scientist.email);
    const started = await scientist.post(`/api/lab/catchments/${catchment}/sweeps`)
      .send({ period: { from: '2022-06-01', to: '2022-08-31' }, axes: [{ variable: 'temperatureDeltaC', from: 0, to: 2, steps: 3 }] });
    expect(started.status, JSON.stringify(started.body)).toBe(202);

    await within(app.ctx.close(), 3000);
    await app.db.destroy();
    const again = createTestApp();
    try {
      expect(await again.db('runs').where({ id: runId }).first('status', 'error_message')).toEqual({ status: 'queued', error_message: null });
      const job = await waitForJob(await signedInAgent(again.app, f.org.users.scientist.email), started.body.id);
      expect(job.status, job.error ?? '').toBe('done');
      expect(sweepResultSchema.parse(job.result).axes[0]!.values).toHaveLength(3);
      await again.db('runs').where({ id: runId }).delete();
    } finally {
      await again.close();
    }
  });

  it("ends as failed, with a message, a lab job whose queue job was lost, when the API starts", async () => {
    const scope = new TenantScope(f.t.db, f.org.organisationId);
    const catchment = await scope.insert('catchments', {
      name: unique('Lost job basin '), description: '', latitude_deg: 46, longitude_deg: 9, time_zone: 'UTC', station_name: 'Camp', station_elevation_m: 2000, outlet_description: '',
    });
    const lost = await scope.insert('lab_jobs', {
      catchment_id: catchment, kind: 'sweep', status: 'running', request: '{}', created_by_name: 'gone', created_at: new Date(Date.now() - 5 * 60_000),
    });
    await f.t.ctx.start();
    expect(await f.t.db('lab_jobs').where({ id: lost }).first('status', 'error_message'))
      .toEqual({ status: 'failed', error_message: expect.stringMatching(/lost by the job queue/) });
  });
});
