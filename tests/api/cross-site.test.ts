import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { routeTable, type RouteListing } from '../../server/routes';
import { signedInAgent, TEST_PASSWORD } from '../support/factories';
import { withOrganisation } from '../support/test-org';

const f = withOrganisation();

const probe = (route: RouteListing) => route.path.replace(/:[A-Za-z]+/g, '0');
const writes = () => routeTable(f.t.ctx).filter((r) => r.method !== 'get');
const label = (route: RouteListing, res: request.Response) => `${route.method.toUpperCase()} ${route.path} → ${res.status} ${JSON.stringify(res.body).slice(0, 100)}`;

describe('writes from another site, for every write route in the route table', () => {
  it('lists the write routes the attacks were seen on', () => {
    const keys = writes().map((r) => `${r.method} ${r.path}`);
    expect(keys).toEqual(expect.arrayContaining([
      'post /api/billing/cancel', 'post /api/auth/sign-out', 'post /api/invitations/:id/resend', 'post /api/catchments/:catchmentId/uploads',
      'post /api/catchments/:catchmentId/scenarios/:id/duplicate', 'post /api/briefings/:id/publish',
    ]));
  });

  it('refuses a bodyless or form post from a browser on another origin with 403, signed in as an admin', async () => {
    const signIn = await request(f.t.app).post('/api/auth/sign-in').send({ email: f.org.users.admin.email, password: TEST_PASSWORD });
    const cookie = signIn.headers['set-cookie']![0]!.split(';')[0]!;
    for (const route of writes()) {
      // What an HTML form on another site sends: no custom header, a form body, the attacker's Origin.
      const forged = await request(f.t.app)[route.method](probe(route))
        .set('Cookie', cookie)
        .set('Origin', 'https://attacker.example').set('Sec-Fetch-Site', 'cross-site')
        .type('form').send('seats=1');
      expect(forged.status, label(route, forged)).toBe(403);
      expect(forged.body.error.code, label(route, forged)).toBe('cross_site');
    }
  });

  it('refuses a write whose Origin is foreign even with JSON and our header (a misconfigured proxy or an old browser)', async () => {
    const agent = await signedInAgent(f.t.app, f.org.users.admin.email);
    for (const route of writes()) {
      const res = await agent[route.method](probe(route)).set('Origin', 'http://127.0.0.1.attacker.example').send({});
      expect(res.status, label(route, res)).toBe(403);
      expect(res.body.error.code, label(route, res)).toBe('cross_site');
    }
  });

  it('refuses a sibling site (Sec-Fetch-Site: same-site) and a multipart post without our header and without Origin', async () => {
    const agent = await signedInAgent(f.t.app, f.org.users.admin.email);
    for (const route of writes()) {
      const sibling = await agent[route.method](probe(route)).set('Sec-Fetch-Site', 'same-site').send({});
      expect(sibling.status, label(route, sibling)).toBe(403);
      const multipart = await request(f.t.app)[route.method](probe(route)).field('variable', 'temperature');
      expect(multipart.status, label(route, multipart)).toBe(403);
      expect(multipart.body.error.code, label(route, multipart)).toBe('cross_site');
    }
  });

  it('lets the same origin through: our client header, no foreign Origin', async () => {
    const agent = await signedInAgent(f.t.app, f.org.users.admin.email);
    const signOutLast = [...writes().filter((r) => !r.path.endsWith('/sign-out')), ...writes().filter((r) => r.path.endsWith('/sign-out'))];
    for (const route of signOutLast) {
      const res = await agent[route.method](probe(route)).set('Sec-Fetch-Site', 'same-origin');
      expect(res.body?.error?.code, label(route, res)).not.toBe('cross_site');
    }
  });

  it('leaves reads alone, whoever links to them', async () => {
    const res = await request(f.t.app).get('/api/health').set('Origin', 'https://attacker.example').set('Sec-Fetch-Site', 'cross-site');
    expect(res.status).toBe(200);
  });
});
