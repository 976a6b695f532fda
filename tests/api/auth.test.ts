import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { createOrganisation, signedInAgent, TEST_PASSWORD, unique, type TestOrg } from '../support/factories';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let org: TestOrg;

beforeAll(async () => {
  t = createTestApp();
  org = await createOrganisation(t.db);
});
afterAll(() => t.close());

const sessionCookie = (res: request.Response) =>
  ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('tarnish_session='));

describe('sign-up', () => {
  it.each([
    ['too short', 'short pass', /at least 12/],
    ['over 72 bytes', 'ä'.repeat(37), /at most 72 bytes/],
    ['a common password', 'Password1234', /breached passwords/],
  ])('refuses a password that is %s', async (_label, password, message) => {
    const res = await request(t.app)
      .post('/api/auth/sign-up')
      .send({ organisationName: 'Org', name: 'N', email: `${unique('p')}@test.example`, password });
    expect(res.status).toBe(422);
    expect(res.body.error.field).toBe('password');
    expect(res.body.error.message).toMatch(message);
  });
});

describe('sign-in, /api/me and sign-out', () => {
  it('signs in, answers /api/me, and rejects the old cookie after sign-out', async () => {
    const res = await request(t.app).post('/api/auth/sign-in').send({ email: org.users.consultant.email, password: TEST_PASSWORD });
    expect(res.status).toBe(200);
    const cookie = sessionCookie(res)!.split(';')[0];

    const me = await request(t.app).get('/api/me').set('Cookie', cookie);
    expect(me.status).toBe(200);
    expect(me.body.user).toMatchObject({ email: org.users.consultant.email, role: 'consultant' });
    expect(me.body.organisation.id).toBe(org.organisationId);

    expect((await request(t.app).post('/api/auth/sign-out').set('Cookie', cookie).set('X-Requested-With', 'tarnish')).status).toBe(204);
    const after = await request(t.app).get('/api/me').set('Cookie', cookie);
    expect(after.status).toBe(401);
    expect(after.body.error.code).toBe('unauthorized');
  });

  it('gives the same answer for a wrong password and an unknown e-mail', async () => {
    const wrongPassword = await request(t.app).post('/api/auth/sign-in').send({ email: org.users.scientist.email, password: 'not the password at all' });
    const unknownEmail = await request(t.app).post('/api/auth/sign-in').send({ email: `${unique('nobody')}@test.example`, password: 'not the password at all' });
    expect(wrongPassword.status).toBe(401);
    expect(unknownEmail.status).toBe(401);
    expect(wrongPassword.body).toEqual(unknownEmail.body);
    expect(sessionCookie(wrongPassword)).toBeUndefined();
  });

  it('answers /api/me without a session with 401 in the error shape', async () => {
    const res = await request(t.app).get('/api/me');
    expect(res.status).toBe(401);
    expect(res.body).toEqual({ error: { code: 'unauthorized', message: expect.any(String) } });
  });

  it('refuses malformed JSON with a clear 400 and no stack trace', async () => {
    const res = await request(t.app).post('/api/auth/sign-in').set('Content-Type', 'application/json').send('{"email":');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad_json');
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.ts/);
  });

  it('refuses an oversized JSON body with 413', async () => {
    const res = await request(t.app).post('/api/auth/sign-in').send({ email: 'a@b.example', password: 'x'.repeat(1_100_000) });
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('too_large');
  });
});

describe('sign-in rate limits', () => {
  it('slows an account down after failures with 429 and Retry-After, and lets the right password in after the short wait', async () => {
    const limited = createTestApp({ SIGNIN_MAX_FAILURES_PER_ACCOUNT: '3', SIGNIN_MAX_FAILURES_PER_IP: '100', SIGNIN_BACKOFF_BASE_MS: '300' });
    try {
      const attempt = (password = 'wrong password here') => request(limited.app).post('/api/auth/sign-in').send({ email: org.users.client.email, password });
      for (let i = 0; i < 3; i++) expect((await attempt()).status).toBe(401);
      const blocked = await attempt();
      expect(blocked.status).toBe(429);
      expect(Number(blocked.headers['retry-after'])).toBeGreaterThan(0);
      expect(blocked.body.error.code).toBe('too_many_attempts');
      // Straight away even the right password waits: guessing stays slow.
      expect((await attempt(TEST_PASSWORD)).status).toBe(429);
      // Another account from the same address is not slowed by this one's failures.
      await signedInAgent(limited.app, org.users.admin.email);
      // Once the delay has passed the owner gets in: failures cannot lock an account.
      await vi.waitFor(async () => expect((await attempt(TEST_PASSWORD)).status).toBe(200), { timeout: 5000, interval: 100 });
      // …and the success clears the count.
      expect((await attempt()).status).toBe(401);
    } finally {
      await limited.close();
    }
  });

  it('limits failures per client address across accounts', async () => {
    const limited = createTestApp({ SIGNIN_MAX_FAILURES_PER_ACCOUNT: '100', SIGNIN_MAX_FAILURES_PER_IP: '4' });
    try {
      for (let i = 0; i < 4; i++) {
        const res = await request(limited.app).post('/api/auth/sign-in').send({ email: `${unique('spray')}@test.example`, password: 'guess guess guess' });
        expect(res.status).toBe(401);
      }
      const blocked = await request(limited.app).post('/api/auth/sign-in').send({ email: org.users.admin.email, password: TEST_PASSWORD });
      expect(blocked.status).toBe(429);
      expect(blocked.headers['retry-after']).toBeDefined();
    } finally {
      await limited.close();
    }
  });
});
