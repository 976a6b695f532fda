import jwt from 'jsonwebtoken';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signSessionToken } from '../../server/services/auth/session-tokens';
import { createOrganisation, type TestOrg } from '../support/factories';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let org: TestOrg;
let secret: string;

beforeAll(async () => {
  t = createTestApp();
  secret = t.config.auth.jwtSecret;
  org = await createOrganisation(t.db);
});
afterAll(() => t.close());

const claimsFor = (_userId: number) => ({ org: org.organisationId, ver: 0, typ: 'session' });
const meWith = (token: string) => request(t.app).get('/api/me').set('Cookie', `tarnish_session=${token}`);

describe('forged and stale session tokens are rejected', () => {
  it('accepts a properly signed token (control)', async () => {
    const token = signSessionToken({ userId: org.users.client.id, organisationId: org.organisationId, tokenVersion: 0 }, secret, 1);
    expect((await meWith(token)).status).toBe(200);
  });

  it('rejects alg "none"', async () => {
    const header = Buffer.from(JSON.stringify({ alg: 'none', typ: 'JWT' })).toString('base64url');
    const payload = Buffer.from(
      JSON.stringify({ ...claimsFor(org.users.admin.id), sub: String(org.users.admin.id), iss: 'tarnish', aud: 'tarnish-web', exp: Math.floor(Date.now() / 1000) + 3600 }),
    ).toString('base64url');
    expect((await meWith(`${header}.${payload}.`)).status).toBe(401);
  });

  it('rejects a token signed with another key', async () => {
    const token = jwt.sign(claimsFor(org.users.admin.id), 'another-secret-of-sufficient-length-0123456789', {
      algorithm: 'HS256', subject: String(org.users.admin.id), issuer: 'tarnish', audience: 'tarnish-web', expiresIn: 3600,
    });
    expect((await meWith(token)).status).toBe(401);
  });

  it('rejects an expired token', async () => {
    const token = jwt.sign({ ...claimsFor(org.users.admin.id), exp: Math.floor(Date.now() / 1000) - 10 }, secret, {
      algorithm: 'HS256', subject: String(org.users.admin.id), issuer: 'tarnish', audience: 'tarnish-web',
    });
    expect((await meWith(token)).status).toBe(401);
  });

  it('rejects a token whose payload was changed (role or user swapped) after signing', async () => {
    const token = signSessionToken({ userId: org.users.client.id, organisationId: org.organisationId, tokenVersion: 0 }, secret, 1);
    const [h, p, s] = token.split('.');
    const payload = JSON.parse(Buffer.from(p, 'base64url').toString());
    const tampered = Buffer.from(JSON.stringify({ ...payload, sub: String(org.users.admin.id), role: 'admin' })).toString('base64url');
    expect((await meWith(`${h}.${tampered}.${s}`)).status).toBe(401);
  });

  it('rejects a token of another type or audience', async () => {
    const wrongType = jwt.sign({ ...claimsFor(org.users.admin.id), typ: 'invitation' }, secret, {
      algorithm: 'HS256', subject: String(org.users.admin.id), issuer: 'tarnish', audience: 'tarnish-web', expiresIn: 3600,
    });
    const wrongAudience = jwt.sign(claimsFor(org.users.admin.id), secret, {
      algorithm: 'HS256', subject: String(org.users.admin.id), issuer: 'tarnish', audience: 'somewhere-else', expiresIn: 3600,
    });
    expect((await meWith(wrongType)).status).toBe(401);
    expect((await meWith(wrongAudience)).status).toBe(401);
  });

  it('rejects a token whose organisation claim does not match the user', async () => {
    const other = await createOrganisation(t.db);
    const token = signSessionToken({ userId: org.users.admin.id, organisationId: other.organisationId, tokenVersion: 0 }, secret, 1);
    expect((await meWith(token)).status).toBe(401);
  });
});
