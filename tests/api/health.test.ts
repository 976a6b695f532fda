import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { catchmentFields } from '../support/catchments';
import { createOrganisation, signedInAgent } from '../support/factories';
import { tcpSwitch } from '../support/tcp-switch';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

describe('GET /api/health', () => {
  it('reports the database and Redis up and the worker process of the tests connected', async () => {
    const res = await request(t.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: 'ok', db: 'up', redis: 'up', workers: expect.any(Number) });
    expect(res.body.workers).toBeGreaterThanOrEqual(1);
  });

  it('lets probes that arrive during a check share it, and checks afresh for the next probe', async () => {
    const real = t.ctx.queues.health.bind(t.ctx.queues);
    let release!: () => void;
    const held = new Promise<void>((resolve) => { release = resolve; });
    const checks = vi.spyOn(t.ctx.queues, 'health').mockImplementation(async () => {
      await held;
      return real();
    });
    try {
      const server = t.app.listen(0, '127.0.0.1');
      await new Promise((resolve) => server.once('listening', resolve));
      try {
        const probes = Array.from({ length: 5 }, () => request(server).get('/api/health').then((res) => res));
        await vi.waitFor(() => expect(checks).toHaveBeenCalledTimes(1));
        // Give the other probes time to arrive while the first check is held.
        await new Promise((resolve) => setTimeout(resolve, 150));
        release();
        const answers = await Promise.all(probes);
        expect(answers.map((res) => res.status)).toEqual([200, 200, 200, 200, 200]);
        expect(checks).toHaveBeenCalledTimes(1);
        expect((await request(server).get('/api/health')).status).toBe(200);
        expect(checks).toHaveBeenCalledTimes(2);
      } finally {
        server.close();
      }
    } finally {
      checks.mockRestore();
    }
  });

  it('reports Redis down with 503 when the queue cannot be reached, and no worker on a queue nobody takes from', async () => {
    const down = createTestApp({ REDIS_PORT: '1' });
    try {
      const res = await request(down.app).get('/api/health');
      expect(res.status).toBe(503);
      expect(res.body).toMatchObject({ status: 'degraded', db: 'up', redis: 'down', workers: 0 });
    } finally {
      await down.close();
    }
    const idle = createTestApp({ QUEUE_PREFIX: 'nobody-takes' });
    try {
      const res = await request(idle.app).get('/api/health');
      expect(res.status).toBe(200);
      expect(res.body).toEqual({ status: 'degraded', db: 'up', redis: 'up', workers: 0 });
    } finally {
      await idle.close();
    }
  });

  it('reports the database down with 503 when the pool cannot connect, and keeps serving', async () => {
    // Port 1 on loopback: nothing listens there, so every connection is refused.
    const down = createTestApp({ DB_PORT: '1' });
    try {
      const res = await request(down.app).get('/api/health');
      expect(res.status).toBe(503);
      expect(res.body).toMatchObject({ status: 'degraded', db: 'down' });
      const again = await request(down.app).get('/api/health');
      expect(again.status).toBe(503);
    } finally {
      await down.close();
    }
  });

  it('recovers by itself when the database comes back', async () => {
    const link = await tcpSwitch(t.config.db.host, t.config.db.port);
    const flaky = createTestApp({ DB_PORT: String(link.port) });
    try {
      expect((await request(flaky.app).get('/api/health')).status).toBe(200);
      link.cut();
      const down = await request(flaky.app).get('/api/health');
      expect(down.status).toBe(503);
      expect(down.body.db).toBe('down');
      link.restore();
      const up = await request(flaky.app).get('/api/health');
      expect(up.status).toBe(200);
      expect(up.body).toMatchObject({ status: 'ok', db: 'up' });
    } finally {
      await flaky.close();
      await link.close();
    }
  });

  it('answers signed-in requests with 503 and Retry-After while the database is gone, and serves them again by itself', async () => {
    const link = await tcpSwitch(t.config.db.host, t.config.db.port);
    const flaky = createTestApp({ DB_PORT: String(link.port) });
    try {
      const org = await createOrganisation(t.db);
      const agent = await signedInAgent(flaky.app, org.users.consultant.email);
      expect((await agent.get('/api/catchments')).status).toBe(200);
      link.cut();
      for (const attempt of [agent.get('/api/catchments'), agent.post('/api/catchments').send(catchmentFields())]) {
        const res = await attempt;
        expect(res.status).toBe(503);
        expect(res.headers['retry-after']).toBe('5');
        expect(res.body.error.code).toBe('database_unavailable');
      }
      link.restore();
      const back = await agent.get('/api/catchments');
      expect(back.status).toBe(200);
    } finally {
      await flaky.close();
      await link.close();
    }
  });

  it('sends a Content-Security-Policy without inline scripts', async () => {
    const res = await request(t.app).get('/api/health');
    const csp = res.headers['content-security-policy'];
    expect(csp).toMatch(/script-src 'self'/);
    expect(csp).not.toMatch(/script-src[^;]*unsafe-inline/);
    expect(csp).toMatch(/base-uri 'none'/);
    expect(csp).toMatch(/form-action 'self'/);
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});
