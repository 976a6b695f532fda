import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { allows } from '../../shared/access/capabilities';
import { ROLES, type Role } from '../../shared/schemas/auth';
import { routeTable, type RouteListing } from '../../server/routes';
import { signedInAgent } from '../support/factories';
import { createTenantWorld, pathIn, snapshotOf, type TenantWorld } from '../support/tenant-world';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let own: TenantWorld;
let foreign: TenantWorld;

beforeAll(async () => {
  t = createTestApp();
  own = await createTenantWorld(t.db, t.config.geodata.dir);
  foreign = await createTenantWorld(t.db, t.config.geodata.dir);
});
afterAll(() => t.close());

const memberRoutes = () => routeTable(t.ctx).filter((r) => r.access !== 'public');
const withIds = (r: RouteListing) => r.path.includes('/:');
/** Ending the session comes last, after everything else the agent does. */
const signOutLast = (routes: RouteListing[]) => [...routes.filter((r) => !r.path.endsWith('/sign-out')), ...routes.filter((r) => r.path.endsWith('/sign-out'))];
const mayCall = (role: Role, route: RouteListing) => route.access === 'public' || allows(role, route.access);
const label = (role: string, route: RouteListing, status: number) => `${role}: ${route.method.toUpperCase()} ${route.path} → ${status}`;

describe('route × role × tenant, from the route table', () => {
  it('resolves every path parameter of every route to a record of both organisations', () => {
    for (const route of memberRoutes().filter(withIds)) {
      expect(pathIn(foreign, route.path)).not.toMatch(/:/);
    }
  });

  it.each(ROLES)("never shows a %s another organisation's records, and lets no write of theirs change one", async (role) => {
    const before = await snapshotOf(t.db, foreign);
    const agent = await signedInAgent(t.app, own.users[role].email);
    for (const route of signOutLast(memberRoutes())) {
      const res = await agent[route.method](withIds(route) ? pathIn(foreign, route.path) : route.path).send({});
      const text = label(role, route, res.status);
      // The payment service is not running here: 502/503 from it are answers, a 500 never is.
      expect(res.status, text).not.toBe(500);
      // Another organisation's names never appear in any answer, whatever the route.
      expect(JSON.stringify(res.body ?? '') + (res.text ?? ''), text).not.toContain(foreign.marker);
      if (!withIds(route)) continue;
      if (!mayCall(role, route)) expect(res.status, text).toBe(403);
      // A foreign id is a record that does not exist (or a request refused before looking it up).
      else expect([400, 404, 422], text).toContain(res.status);
    }
    expect(await snapshotOf(t.db, foreign), `${role} changed another organisation's records`).toBe(before);
  });

  it.each(ROLES)('lets a %s reach its own organisation\'s records by the same paths (the ids above are real)', async (role) => {
    const agent = await signedInAgent(t.app, own.users[role].email);
    const reads = memberRoutes().filter((r) => withIds(r) && r.method === 'get' && mayCall(role, r));
    for (const route of reads) {
      const res = await agent.get(pathIn(own, route.path));
      const text = label(role, route, res.status);
      expect(res.status, text).not.toBe(404);
      expect(res.status, text).not.toBe(500);
      // Its answers and exports hold tenant data: never kept by a browser or a shared cache.
      expect(res.headers['cache-control'], text).toBe('no-store');
    }
  });
});
