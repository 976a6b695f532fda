import http from 'node:http';
import { describe, expect, it, vi } from 'vitest';
import { listenDraining } from '../../server/http-server';
import request from 'supertest';
import { TEST_PASSWORD } from '../support/factories';
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
