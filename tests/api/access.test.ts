import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { allows } from '../../shared/access/capabilities';
import { ROLES } from '../../shared/schemas/auth';
import { routeTable, type RouteListing } from '../../server/routes';
import { catchmentFields } from '../support/catchments';
import { createOrganisation, signedInAgent, type TestOrg } from '../support/factories';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let orgA: TestOrg;
let orgB: TestOrg;

beforeAll(async () => {
  t = createTestApp();
  orgA = await createOrganisation(t.db);
  orgB = await createOrganisation(t.db);
});
afterAll(() => t.close());

/** The route with every path parameter set to 0: no such record, so an allowed call changes nothing. */
const probe = (route: RouteListing) => route.path.replace(/:[A-Za-z]+/g, '0');
/** Ending the session is checked on its own, after everything else the agent does. */
const isSignOut = (route: RouteListing) => route.path === '/api/auth/sign-out';

describe('the route table', () => {
  it('lists every API route once, each with who may call it', () => {
    const routes = routeTable(t.ctx);
    const keys = routes.map((r) => `${r.method} ${r.path}`);
    expect(new Set(keys).size).toBe(keys.length);
    expect(keys).toEqual(expect.arrayContaining([
      'get /api/health', 'post /api/auth/sign-in', 'get /api/me', 'get /api/catchments/:catchmentId/runs', 'post /api/lab/catchments/:catchmentId/sweeps',
      'get /api/briefings/:id/versions/:version/pdf', 'post /api/billing/webhook',
    ]));
    expect(routes.find((r) => r.path === '/api/billing/webhook')?.access).toBe('public');
  });
});

describe('route × role, from the route table and the capability table', () => {
  it('answers 401 to a signed-out visitor on every route that needs a session, and lets public routes through', async () => {
    for (const route of routeTable(t.ctx)) {
      const res = await request(t.app)[route.method](probe(route)).send({});
      const label = `${route.method.toUpperCase()} ${route.path}`;
      if (route.access === 'public') expect(res.status, label).not.toBe(401);
      else expect(res.status, label).toBe(401);
      expect(res.status, label).toBeLessThan(500);
    }
  });

  it.each(ROLES)('lets a %s call exactly the routes its capabilities allow', async (role) => {
    const agent = await signedInAgent(t.app, orgA.users[role].email);
    const routes = routeTable(t.ctx).filter((r) => r.access !== 'public');
    for (const route of [...routes.filter((r) => !isSignOut(r)), ...routes.filter(isSignOut)]) {
      const res = await agent[route.method](probe(route)).send({});
      const label = `${role}: ${route.method.toUpperCase()} ${route.path} → ${res.status} ${JSON.stringify(res.body).slice(0, 120)}`;
      if (route.access === 'public' || allows(role, route.access)) {
        expect([401, 403], label).not.toContain(res.status);
      } else {
        expect(res.status, label).toBe(403);
        expect(res.body.error.code, label).toBe('forbidden');
      }
      // The payment service is not running here: 503 upstream_unavailable is an answer, a 500 never is.
      expect(res.status, label).not.toBe(500);
      // Signed-in answers are never cached, whatever they are (so none carries an entity tag to revalidate).
      expect(res.headers['cache-control'], label).toBe('no-store');
      expect(res.headers.etag, label).toBeUndefined();
    }
  });
});

describe('one sign-in check per request', () => {
  it('verifies the session and loads the user once, however deeply the route is nested', async () => {
    const agent = await signedInAgent(t.app, orgA.users.consultant.email);
    const created = await agent.post('/api/catchments').send(catchmentFields());
    expect(created.status).toBe(201);
    const id = created.body.catchment.id as number;
    const loads = vi.spyOn(t.ctx.auth, 'activeUser');
    try {
      for (const path of [
        `/api/catchments/${id}`, `/api/catchments/${id}/runs`, `/api/catchments/${id}/scenarios`, `/api/catchments/${id}/bands`,
        `/api/catchments/${id}/bands.csv`, `/api/catchments/${id}/datasets`, `/api/lab/catchments/${id}/jobs`, '/api/briefings', '/api/me',
      ]) {
        loads.mockClear();
        const res = await agent.get(path);
        expect(res.status, path).toBe(200);
        expect(loads, path).toHaveBeenCalledTimes(1);
      }
    } finally {
      loads.mockRestore();
    }
  });
});

describe('role guard on admin routes', () => {
  it('lets the admin list only their own organisation', async () => {
    const agent = await signedInAgent(t.app, orgA.users.admin.email);
    const res = await agent.get('/api/members');
    expect(res.status).toBe(200);
    const emails = res.body.members.map((m: { email: string }) => m.email).sort();
    expect(emails).toEqual(Object.values(orgA.users).map((u) => u.email).sort());
    expect(JSON.stringify(res.body)).not.toMatch(/password_hash|token_version/);
  });
});

describe('tenant isolation', () => {
  it("answers 404 when organisation A's admin asks for organisation B's member", async () => {
    const agent = await signedInAgent(t.app, orgA.users.admin.email);
    const foreign = await agent.get(`/api/members/${orgB.users.consultant.id}`);
    expect(foreign.status).toBe(404);
    const own = await agent.get(`/api/members/${orgA.users.consultant.id}`);
    expect(own.status).toBe(200);
    expect(own.body.member.email).toBe(orgA.users.consultant.email);
  });

  it('answers 404 for ids that are not numbers', async () => {
    const agent = await signedInAgent(t.app, orgA.users.admin.email);
    const res = await agent.get('/api/members/abc');
    expect(res.status).toBe(404);
    expect(res.body.error.message).toBe('Member not found.');
  });

  it('answers unknown API paths with 404 in the error shape', async () => {
    const res = await (await signedInAgent(t.app, orgA.users.admin.email)).get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });
});
