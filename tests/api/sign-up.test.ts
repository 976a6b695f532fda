import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SIGN_UP_REPLY } from '../../shared/schemas/auth';
import { createOrganisation, signedInAgent, unique, type TestOrg } from '../support/factories';
import { startTeamHarness, type TeamHarness } from '../support/team-harness';

let h: TeamHarness;
let org: TestOrg;
let other: TestOrg;

beforeAll(async () => {
  h = await startTeamHarness({ SIGNUPS_PER_IP_PER_HOUR: '1000', SIGNUPS_PER_ADDRESS_PER_HOUR: '100' });
  org = await createOrganisation(h.t.db);
  other = await createOrganisation(h.t.db);
});
afterAll(() => h.close());

const signUp = (email: string, app = h.t.app) =>
  request(app).post('/api/auth/sign-up').send({ organisationName: 'Gletscherblick Partners', name: 'Mara Quell', email, password: 'a long enough passphrase' });
const linkIn = (text: string) => /\/confirm-sign-up\?token=([A-Za-z0-9_-]{43})/.exec(text)?.[1];

describe('one answer to every sign-up', () => {
  it('gives a new address and a taken one the same answer, with no session', async () => {
    const fresh = await signUp(`${unique('founder')}@test.example`);
    const taken = await signUp(org.users.consultant.email);
    for (const res of [fresh, taken]) {
      expect(res.status).toBe(202);
      expect(res.body).toEqual({ message: SIGN_UP_REPLY });
      expect(res.headers['set-cookie']).toBeUndefined();
    }
  });

  it("tells the taken address's owner by mail, and changes nothing of their account", async () => {
    const before = await h.t.db('users').where({ email: org.users.admin.email }).first();
    expect((await signUp(org.users.admin.email)).status).toBe(202);
    const mail = await h.catcher.waitFor((m) => m.to.includes(org.users.admin.email) && m.subject.includes('already has'));
    expect(mail.text).toContain(`${h.baseUrl}/forgot-password`);
    expect(linkIn(mail.text)).toBeUndefined();
    expect(await h.t.db('users').where({ email: org.users.admin.email }).first()).toEqual(before);
  });

  it('mails a new address a link that finishes the account and signs its admin in', async () => {
    const email = `${unique('founder')}@test.example`;
    expect((await signUp(email)).status).toBe(202);
    expect((await request(h.t.app).post('/api/auth/sign-in').send({ email, password: 'a long enough passphrase' })).status).toBe(401);
    const mail = await h.catcher.waitFor((m) => m.to.includes(email));
    const token = linkIn(mail.text)!;
    const confirmed = await request(h.t.app).post('/api/auth/sign-up/confirm').send({ token });
    expect(confirmed.status).toBe(200);
    expect(confirmed.body.user).toMatchObject({ email, role: 'admin', status: 'active' });
    expect(confirmed.body.organisation.name).toBe('Gletscherblick Partners');
    expect(([] as string[]).concat(confirmed.headers['set-cookie'] ?? [])[0]).toMatch(/HttpOnly/);
    // The link works once.
    expect((await request(h.t.app).post('/api/auth/sign-up/confirm').send({ token })).status).toBe(400);
    expect((await request(h.t.app).post('/api/auth/sign-in').send({ email, password: 'a long enough passphrase' })).status).toBe(200);
  });

  it('makes one account of eight identical sign-ups at once, all answered alike', async () => {
    const email = `${unique('twin')}@test.example`;
    const answers = await Promise.all(Array.from({ length: 8 }, () => signUp(email)));
    expect(answers.map((a) => a.status)).toEqual(Array(8).fill(202));
    expect(Number((await h.t.db('users').where({ email }).count({ n: '*' }))[0]!.n)).toBe(1);
  });
});

describe('sign-up limits', () => {
  it('limits sign-ups per address and per client address, with 429 and Retry-After', async () => {
    const limited = await startTeamHarness({ SIGNUPS_PER_ADDRESS_PER_HOUR: '2', SIGNUPS_PER_IP_PER_HOUR: '5' });
    try {
      const email = `${unique('again')}@test.example`;
      expect((await signUp(email, limited.t.app)).status).toBe(202);
      expect((await signUp(email, limited.t.app)).status).toBe(202);
      const third = await signUp(email, limited.t.app);
      expect(third.status).toBe(429);
      expect(third.headers['retry-after']).toBeDefined();
      expect(third.body.error.code).toBe('too_many_sign_ups');
      const statuses: number[] = [];
      for (let i = 0; i < 4; i++) statuses.push((await signUp(`${unique('spray')}@test.example`, limited.t.app)).status);
      expect(statuses).toEqual([202, 202, 429, 429]);
    } finally {
      await limited.close();
    }
  });
});

describe("another organisation's addresses are not named", () => {
  it('answers an invitation of a foreign member like any invitation, and tells the address instead', async () => {
    const admin = await signedInAgent(h.t.app, org.users.admin.email);
    const foreign = await admin.post('/api/invitations').send({ email: other.users.scientist.email, name: 'Someone', role: 'client' });
    const fresh = await admin.post('/api/invitations').send({ email: `${unique('new')}@test.example`, name: 'Someone', role: 'client' });
    expect(foreign.status).toBe(202);
    expect(fresh.status).toBe(202);
    expect(foreign.body.message.replace(other.users.scientist.email, '')).toBe(fresh.body.message.replace(/\S+@test\.example/, ''));
    const mail = await h.catcher.waitFor((m) => m.to.includes(other.users.scientist.email));
    expect(mail.subject).toMatch(/could not be sent/);
    expect((await h.t.db('users').where({ email: other.users.scientist.email }).first()).organisation_id).toBe(other.organisationId);
  });
});
