import jwt from 'jsonwebtoken';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createOrganisation, signedInAgent, TEST_PASSWORD, type TestOrg } from '../support/factories';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let secure: TestApp;
let org: TestOrg;

beforeAll(async () => {
  t = createTestApp();
  secure = createTestApp({ COOKIE_SECURE: 'true' });
  org = await createOrganisation(t.db);
});
afterAll(async () => {
  await secure.close();
  await t.close();
});

const signIn = (app: TestApp['app'], email: string, password = TEST_PASSWORD) => request(app).post('/api/auth/sign-in').send({ email, password });

describe('the session cookie with production settings', () => {
  it('is __Host- prefixed, Secure, HttpOnly, SameSite=Lax, for the whole site and no other host', async () => {
    const res = await signIn(secure.app, org.users.consultant.email);
    expect(res.status).toBe(200);
    const cookie = ([] as string[]).concat(res.headers['set-cookie'] ?? [])[0]!;
    expect(cookie).toMatch(/^__Host-tarnish_session=/);
    expect(cookie).toMatch(/; Secure/);
    expect(cookie).toMatch(/; HttpOnly/);
    expect(cookie).toMatch(/; SameSite=Lax/);
    expect(cookie).toMatch(/; Path=\//);
    expect(cookie).not.toMatch(/Domain=/i);
    const me = await request(secure.app).get('/api/me').set('Cookie', cookie.split(';')[0]!);
    expect(me.status).toBe(200);
    // The unprefixed name is not read when the cookie must be Secure.
    const plain = cookie.split(';')[0]!.replace('__Host-', '');
    expect((await request(secure.app).get('/api/me').set('Cookie', plain)).status).toBe(401);
  });
});

describe('claims every session token must carry', () => {
  const meWith = (token: string) => request(t.app).get('/api/me').set('Cookie', `tarnish_session=${token}`);
  const signed = (options: jwt.SignOptions, payload: object = {}) =>
    jwt.sign({ org: org.organisationId, ver: 0, typ: 'session', ...payload }, t.config.auth.jwtSecret, {
      algorithm: 'HS256', subject: String(org.users.client.id), issuer: 'tarnish', audience: 'tarnish-web', ...options,
    });

  it('accepts a token with every claim (control)', async () => {
    expect((await meWith(signed({ expiresIn: 3600 }))).status).toBe(200);
  });

  it('refuses a properly signed token without an expiry', async () => {
    expect((await meWith(signed({})))).toHaveProperty('status', 401);
  });

  it('refuses a token without issued-at, or living longer than a session may', async () => {
    expect((await meWith(signed({ expiresIn: 3600, noTimestamp: true }))).status).toBe(401);
    expect((await meWith(signed({ expiresIn: 365 * 86_400 }))).status).toBe(401);
  });

  it('refuses a token without an issuer or an audience', async () => {
    const bare = jwt.sign({ org: org.organisationId, ver: 0, typ: 'session', sub: String(org.users.client.id) }, t.config.auth.jwtSecret, { algorithm: 'HS256', expiresIn: 3600 });
    expect((await meWith(bare)).status).toBe(401);
  });
});

describe('changing the password', () => {
  it('needs the current password, ends every other session, and keeps this one', async () => {
    const mine = await createOrganisation(t.db);
    const email = mine.users.scientist.email;
    const here = await signedInAgent(t.app, email);
    const elsewhere = await signedInAgent(t.app, email);
    const newPassword = 'moraine lichen quartz 1987';

    const wrong = await here.post('/api/auth/password').send({ currentPassword: 'not my password', newPassword });
    expect(wrong.status).toBe(403);
    expect(wrong.body.error.field).toBe('currentPassword');

    const changed = await here.post('/api/auth/password').send({ currentPassword: TEST_PASSWORD, newPassword });
    expect(changed.status).toBe(200);
    expect(changed.body.user.email).toBe(email);
    expect((await here.get('/api/me')).status).toBe(200);
    expect((await elsewhere.get('/api/me')).status).toBe(401);

    expect((await signIn(t.app, email)).status).toBe(401);
    expect((await signIn(t.app, email, newPassword)).status).toBe(200);
  });

  it('refuses a common password as the new one', async () => {
    const mine = await createOrganisation(t.db);
    const agent = await signedInAgent(t.app, mine.users.admin.email);
    const res = await agent.post('/api/auth/password').send({ currentPassword: TEST_PASSWORD, newPassword: 'qwertyuiop123' });
    expect(res.status).toBe(422);
    expect(res.body.error.field).toBe('newPassword');
  });
});

describe('the session check under concurrent requests', () => {
  it("shares one read of the user's row among checks that arrive together, and refuses a session revoked before the next check", async () => {
    const user = org.users.scientist;
    const row = await t.db('users').where({ id: user.id }).first('token_version');
    const reads: string[] = [];
    const countReads = (query: { sql: string }) => {
      if (/from `users`/.test(query.sql)) reads.push(query.sql);
    };
    t.db.on('query', countReads);
    try {
      const together = await Promise.all(Array.from({ length: 6 }, () => t.ctx.auth.activeUser(user.id, org.organisationId, row.token_version)));
      expect(together.every((u) => u?.id === user.id)).toBe(true);
      expect(reads).toHaveLength(1);
      // Each request got a copy of its own.
      expect(new Set(together).size).toBe(6);

      await t.db('users').where({ id: user.id }).increment('token_version', 1);
      expect(await t.ctx.auth.activeUser(user.id, org.organisationId, row.token_version)).toBeNull();
      expect(reads).toHaveLength(2);
      // The row's organisation is checked, not taken from the token.
      expect(await t.ctx.auth.activeUser(user.id, org.organisationId + 1, row.token_version + 1)).toBeNull();
    } finally {
      t.db.removeListener('query', countReads);
      await t.db('users').where({ id: user.id }).update({ token_version: row.token_version });
    }
  });
});
