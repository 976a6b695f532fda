import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createOrganisation, signedInAgent, TEST_PASSWORD, unique, type TestOrg } from '../support/factories';
import { startTeamHarness, type TeamHarness } from '../support/team-harness';
import { createTestApp } from '../support/test-app';

let h: TeamHarness;
let org: TestOrg;
const NEW_PASSWORD = 'snowline moved up the north face';

beforeAll(async () => {
  h = await startTeamHarness({ MAILS_PER_ADDRESS_PER_HOUR: '2' });
  org = await createOrganisation(h.t.db);
});
afterAll(() => h.close());

const ask = (email: string) => request(h.t.app).post('/api/password-reset/request').send({ email });
const complete = (token: string, password = NEW_PASSWORD) => request(h.t.app).post('/api/password-reset/complete').send({ token, password });
const tokenIn = (text: string) => /\/reset-password\?token=([A-Za-z0-9_-]{43})/.exec(text)![1]!;

async function resetTokenFor(email: string): Promise<string> {
  const before = h.catcher.messages().map((m) => m.id);
  expect((await ask(email)).status).toBe(202);
  const mail = await h.catcher.waitFor((m) => m.to.includes(email) && !before.includes(m.id));
  return tokenIn(mail.text);
}

describe('asking for a reset', () => {
  it('answers the same whether or not the address has an account, and mails only the account', async () => {
    const unknown = `${unique('nobody')}@test.example`;
    const known = await ask(org.users.scientist.email);
    const missing = await ask(unknown);
    expect(missing.status).toBe(known.status);
    expect(missing.body).toEqual(known.body);
    await h.catcher.waitFor((m) => m.to.includes(org.users.scientist.email));
    expect(h.catcher.messages().some((m) => m.to.includes(unknown))).toBe(false);
  });

  it('sends at most the hourly limit of mails to one address, with the same reply', async () => {
    const other = await createOrganisation(h.t.db);
    const email = other.users.client.email;
    const replies = [];
    for (let i = 0; i < 4; i += 1) replies.push(await ask(email));
    expect(new Set(replies.map((r) => JSON.stringify([r.status, r.body]))).size).toBe(1);
    // A mail goes out only with a reset link, and the links are stored before the replies: two links, two mails.
    expect(await h.t.db('password_reset_tokens').where({ user_id: other.users.client.id })).toHaveLength(2);
    const mailsTo = () => h.catcher.messages().filter((m) => m.to.includes(email));
    await h.catcher.waitFor(() => mailsTo().length >= 2);
    expect(mailsTo()).toHaveLength(2);
  });
});

describe('using the link', () => {
  it('sets the new password once, ends earlier sessions and voids the link', async () => {
    const email = org.users.consultant.email;
    const session = await signedInAgent(h.t.app, email);
    const token = await resetTokenFor(email);
    const res = await complete(token);
    expect(res.status).toBe(200);
    expect((await session.get('/api/me')).status).toBe(401);
    await signedInAgent(h.t.app, email, NEW_PASSWORD);
    const old = await request(h.t.app).post('/api/auth/sign-in').send({ email, password: TEST_PASSWORD });
    expect(old.status).toBe(401);
    const again = await complete(token, 'yet another long password');
    expect(again.status).toBe(400);
    expect(again.body.error.code).toBe('invalid_token');
  });

  it('refuses an expired link and a wrong one', async () => {
    const other = await createOrganisation(h.t.db);
    const token = await resetTokenFor(other.users.admin.email);
    await h.t.db('password_reset_tokens').where({ user_id: other.users.admin.id }).update({ expires_at: new Date(Date.now() - 1000) });
    expect((await complete(token)).status).toBe(400);
    expect((await complete('B'.repeat(43))).status).toBe(400);
    await signedInAgent(h.t.app, other.users.admin.email, TEST_PASSWORD);
  });
});

describe('a reset sent by an admin', () => {
  it("mails the member a working link naming the admin, for the admin's own members only", async () => {
    const team = await createOrganisation(h.t.db);
    const admin = await signedInAgent(h.t.app, team.users.admin.email);
    const res = await admin.post(`/api/members/${team.users.scientist.id}/password-reset`);
    expect(res.status).toBe(200);
    expect(res.body.message).toContain(team.users.scientist.email);
    const mail = await h.catcher.waitFor((m) => m.to.includes(team.users.scientist.email));
    expect(mail.text).toContain('an admin of your team, sent you a link');
    expect((await complete(tokenIn(mail.text))).status).toBe(200);
    await signedInAgent(h.t.app, team.users.scientist.email, NEW_PASSWORD);
    // Another organisation's member is not found; a consultant may not send resets.
    expect((await admin.post(`/api/members/${org.users.client.id}/password-reset`)).status).toBe(404);
    const consultant = await signedInAgent(h.t.app, team.users.consultant.email);
    expect((await consultant.post(`/api/members/${team.users.client.id}/password-reset`)).status).toBe(403);
  });

  it('refuses a member who has not joined yet', async () => {
    const team = await createOrganisation(h.t.db);
    await h.t.db('users').where({ id: team.users.client.id }).update({ status: 'invited' });
    const admin = await signedInAgent(h.t.app, team.users.admin.email);
    const res = await admin.post(`/api/members/${team.users.client.id}/password-reset`);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toContain('has not joined yet');
  });
});

describe('development inbox', () => {
  it('lists caught mails outside production', async () => {
    const res = await request(h.t.app).get('/api/dev/inbox');
    expect(res.status).toBe(200);
    expect(res.body.messages.length).toBeGreaterThan(0);
    expect(res.body.messages[0]).toMatchObject({ subject: expect.any(String), to: expect.any(Array) });
  });

  it('is off (404) in production, even with a catcher beside the app', async () => {
    const production = createTestApp(
      { NODE_ENV: 'production', JWT_SECRET: 'x'.repeat(40), STRIPE_SECRET_KEY: 'sk_live_example', STRIPE_WEBHOOK_SECRET: 'whsec_example', PUBLIC_URL: 'https://tarnish.example' },
      { inbox: h.catcher },
    );
    try {
      expect((await request(production.app).get('/api/dev/inbox')).status).toBe(404);
    } finally {
      await production.close();
    }
  });
});
