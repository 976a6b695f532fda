import { afterAll, beforeAll, describe, expect, it } from 'vitest';
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

describe('role guard on admin routes', () => {
  it.each(['consultant', 'scientist', 'client'] as const)('answers 403 to a %s on the member list', async (role) => {
    const agent = await signedInAgent(t.app, orgA.users[role].email);
    const res = await agent.get('/api/members');
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('forbidden');
  });

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
    expect((await agent.get('/api/members/abc')).status).toBe(404);
  });

  it('answers unknown API paths with 404 in the error shape', async () => {
    const res = await (await signedInAgent(t.app, orgA.users.admin.email)).get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });
});
