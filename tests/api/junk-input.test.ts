import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createOrganisation, signedInAgent } from '../support/factories';
import { grantActivePlan } from '../support/paid-plan';
import { createTestApp, type TestApp } from '../support/test-app';
import { routeTable } from '../../server/routes';

/**
 * Malformed ids, queries and bodies sent to every kind of route must get a clear 4xx in the
 * error shape, never a 500 or a stack trace.
 */
let t: TestApp;
let catchmentId: number;
let agent: Awaited<ReturnType<typeof signedInAgent>>;

beforeAll(async () => {
  t = createTestApp();
  const org = await createOrganisation(t.db);
  await grantActivePlan(t.db, org.organisationId);
  agent = await signedInAgent(t.app, org.users.admin.email);
  const created = await agent.post('/api/catchments').send({
    name: 'Junk probe', description: '', latitudeDeg: 34, longitudeDeg: 79, timeZone: 'Asia/Kolkata',
    stationName: 'Probe', stationElevationM: 3400, outletDescription: '',
  });
  if (created.status !== 201) throw new Error(`catchment not created: ${created.status} ${JSON.stringify(created.body)}`);
  catchmentId = created.body.catchment.id;
});
afterAll(() => t.close());

const ID_JUNK = ['abc', '-1', '0', '1.5', '99999999999999999999', '%00'];
const BODY_JUNK: unknown[] = [null, [], 'text', 42, { id: { $gt: 1 } }];

const c = () => `/api/catchments/${catchmentId}`;
const readPaths = () => [
  ...ID_JUNK.map((id) => `/api/catchments/${id}`),
  ...ID_JUNK.map((id) => `${c()}/datasets/${id}/series`),
  ...ID_JUNK.map((id) => `${c()}/runs/${id}/results`),
  ...ID_JUNK.map((id) => `${c()}/scenarios/${id}`),
  ...ID_JUNK.map((id) => `/api/briefings/${id}/versions/${id}`),
  ...ID_JUNK.map((id) => `/api/lab/jobs/${id}`),
  ...ID_JUNK.map((id) => `/api/members/${id}`),
  '/api/catchments?page=abc&pageSize=-5&sortBy=password_hash&descending=maybe',
  `${c()}/preview-input?from=zzz&to=2022-13-45`,
  `/api/lab/catchments/${catchmentId}/surface-response?band=abc&from=x&to=y`,
  `/api/lab/catchments/${catchmentId}/reference-models?band=-3`,
];

const writeCalls = () => [
  ['post', '/api/invitations/preview'], ['post', '/api/catchments'], ['put', `${c()}`], ['put', `${c()}/bands`], ['post', `${c()}/scenarios`],
  ['post', `${c()}/runs`], ['post', '/api/briefings'], ['post', `/api/lab/catchments/${catchmentId}/skill`],
  ['post', `/api/lab/catchments/${catchmentId}/sweeps`], ['put', `/api/lab/catchments/${catchmentId}/calibration`],
  ['post', '/api/invitations'], ['put', '/api/billing/seats'], ['post', '/api/billing/checkout'],
  ['patch', '/api/members/1'], ['post', '/api/auth/sign-in'], ['post', '/api/password-reset/complete'],
] as const;

/** A 4xx in the error shape or a success; a service the route needs being away (this test runs no mail server or payment fake) is a 503, which is right; a 500 never is. */
function expectNoFault(res: { status: number; headers: Record<string, string>; body: { error?: { code?: string; message?: string } } }, label: string): void {
  if (res.status >= 500) expect(`${res.status} ${res.body.error?.code}`, label).toMatch(/^503 \w+_unavailable$/);
  if (res.status < 400) return;
  // Even from a route that had named an image or a CSV file before it failed.
  expect(res.headers['content-type'], label).toMatch(/^application\/json/);
  expect(res.headers['content-disposition'], label).toBeUndefined();
  expect(res.body.error?.message, label).toEqual(expect.any(String));
}

describe('junk input never gives a 500', () => {
  it('answers malformed ids and queries with a 4xx in the error shape', async () => {
    for (const path of readPaths()) {
      const res = await agent.get(path);
      expect(res.status, path).toBeGreaterThanOrEqual(400);
      expect(res.status, path).toBeLessThan(500);
      expect(res.body.error?.message, path).toEqual(expect.any(String));
    }
  });

  it('answers bodies of the wrong type with a 4xx in the error shape', async () => {
    for (const [method, path] of writeCalls()) {
      for (const body of BODY_JUNK) {
        const res = await agent[method](path).set('Content-Type', 'application/json').send(JSON.stringify(body));
        expect(res.status, `${method} ${path} ${JSON.stringify(body)}`).toBeGreaterThanOrEqual(400);
        expect(res.status, `${method} ${path} ${JSON.stringify(body)}`).toBeLessThan(500);
        expect(JSON.stringify(res.body)).not.toMatch(/at .+\.ts:\d+/);
      }
    }
  });

  it('answers junk bodies and queries on every route of the route table with a 4xx, a success or a 503, never a 500', async () => {
    // Every path parameter names the probe catchment's id (ids of other kinds then simply do not exist); tokens are made up.
    const fill = (path: string) => path.replace(/:(\w+)/g, (_m, name: string) => (/token/i.test(name) ? 'A'.repeat(43) : String(catchmentId)));
    const routes = routeTable(t.ctx).filter((r) => !r.path.startsWith('/api/billing/webhook') && r.path !== '/api/auth/sign-out');
    expect(routes.length).toBeGreaterThan(60);
    for (const route of routes) {
      const path = fill(route.path);
      const method = route.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
      if (method === 'get' || method === 'delete') {
        const res = await agent[method](`${path}?from=zzz&to=2022-13-45&band=-1&page=abc&year=x&format=exe`);
        expectNoFault(res, `${route.method} ${route.path} → ${JSON.stringify(res.body)}`);
        continue;
      }
      for (const body of BODY_JUNK) {
        const res = await agent[method](path).set('Content-Type', 'application/json').send(JSON.stringify(body));
        const label = `${route.method} ${route.path} ${JSON.stringify(body)} → ${JSON.stringify(res.body)}`;
        expectNoFault(res, label);
      }
    }
  }, 120_000);
});
