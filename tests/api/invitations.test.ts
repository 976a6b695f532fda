import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hashMailToken } from '../../server/services/mail/mail-tokens';
import { createOrganisation, signedInAgent, unique, userIdOf, type TestOrg } from '../support/factories';
import { startTeamHarness, type TeamHarness } from '../support/team-harness';

let h: TeamHarness;
let org: TestOrg;
const NEW_PASSWORD = 'meltwater gauge at the old weir';

beforeAll(async () => {
  h = await startTeamHarness({ MAILS_PER_ADDRESS_PER_HOUR: '3' });
  org = await createOrganisation(h.t.db);
  await h.subscribe(org, 10);
});
afterAll(() => h.close());

/** Invites a new address and returns the token from the mail that arrived in the catcher. */
async function inviteAndReadMail(role = 'consultant') {
  const email = `${unique('inv')}@test.example`;
  const admin = await signedInAgent(h.t.app, org.users.admin.email);
  const res = await admin.post('/api/invitations').send({ email, name: 'Mira Staen', role });
  expect(res.status).toBe(202);
  const mail = await h.catcher.waitFor((m) => m.to.includes(email));
  return { email, id: await userIdOf(h.t.db, email), mail, token: tokenIn(mail.text) };
}

const tokenIn = (text: string) => /\/invitation\?token=([A-Za-z0-9_-]{43})/.exec(text)![1]!;
const accept = (token: string, password = NEW_PASSWORD) =>
  request(h.t.app).post('/api/invitations/accept').send({ token, name: 'Mira Staen', password });

describe('invitation mail', () => {
  it('carries a link to the app with a token stored only as its hash', async () => {
    const { mail, token, id } = await inviteAndReadMail();
    expect(mail.subject).toContain('You are invited to');
    expect(mail.text).toContain(`${h.baseUrl}/invitation?token=`);
    const rows = await h.t.db('invitations').where({ user_id: id });
    expect(rows).toHaveLength(1);
    expect(rows[0].token_hash).toBe(hashMailToken(token));
    expect(JSON.stringify(rows)).not.toContain(token);
  });
});

describe('accepting', () => {
  it('sets the password, makes the member active, and works only once', async () => {
    const { email, token } = await inviteAndReadMail();
    const preview = await request(h.t.app).post('/api/invitations/preview').send({ token });
    expect(preview.status).toBe(200);
    expect(preview.body).toMatchObject({ email, role: 'consultant' });
    // The token never travels in a URL (where proxies, logs and the browser history keep it).
    const inUrl = await request(h.t.app).get(`/api/invitations/preview?token=${token}`);
    expect(inUrl.status).not.toBe(200);
    expect(JSON.stringify(inUrl.body)).not.toContain(email);

    const first = await accept(token);
    expect(first.status).toBe(200);
    const user = await h.t.db('users').where({ email }).first();
    expect(user).toMatchObject({ status: 'active', organisation_id: org.organisationId, role: 'consultant' });
    await signedInAgent(h.t.app, email, NEW_PASSWORD);

    const second = await accept(token, 'another long password here');
    expect(second.status).toBe(400);
    expect(second.body.error.code).toBe('invalid_token');
    expect((await request(h.t.app).post('/api/invitations/preview').send({ token })).status).toBe(400);
    await signedInAgent(h.t.app, email, NEW_PASSWORD);
  });

  it('refuses an expired link', async () => {
    const { id, token, email } = await inviteAndReadMail();
    await h.t.db('invitations').where({ user_id: id }).update({ expires_at: new Date(Date.now() - 1000) });
    const res = await accept(token);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_token');
    expect((await h.t.db('users').where({ email }).first()).status).toBe('invited');
  });

  it('refuses a wrong or malformed token', async () => {
    await inviteAndReadMail();
    const wrong = await accept('A'.repeat(43));
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.code).toBe('invalid_token');
    expect((await accept('short')).status).toBe(422);
  });

  it('refuses a weak password and keeps the link usable', async () => {
    const { token } = await inviteAndReadMail();
    const weak = await accept(token, 'short');
    expect(weak.status).toBe(422);
    expect(weak.body.error.field).toBe('password');
    expect((await accept(token)).status).toBe(200);
  });

  it('voids the earlier link when the invitation is sent again', async () => {
    const { id, email, token: first } = await inviteAndReadMail();
    const admin = await signedInAgent(h.t.app, org.users.admin.email);
    expect((await admin.post(`/api/invitations/${id}/resend`)).status).toBe(200);
    const second = await h.catcher.waitFor((m) => m.to.includes(email) && !m.text.includes(first));
    expect((await accept(first)).status).toBe(400);
    expect((await accept(tokenIn(second.text))).status).toBe(200);
  });

  it('stops a removed invitation from being accepted', async () => {
    const { id, token } = await inviteAndReadMail('client');
    const admin = await signedInAgent(h.t.app, org.users.admin.email);
    expect((await admin.delete(`/api/members/${id}`)).status).toBe(204);
    expect((await accept(token)).status).toBe(400);
  });
});

describe('mail limits', () => {
  it('refuses more invitation mails to one address than the hourly limit', async () => {
    const { id } = await inviteAndReadMail();
    const admin = await signedInAgent(h.t.app, org.users.admin.email);
    const statuses = [];
    for (let i = 0; i < 3; i += 1) statuses.push((await admin.post(`/api/invitations/${id}/resend`)).status);
    expect(statuses).toEqual([200, 200, 429]);
  });

  it('refuses to invite an address that already has an account', async () => {
    const admin = await signedInAgent(h.t.app, org.users.admin.email);
    const res = await admin.post('/api/invitations').send({ email: org.users.scientist.email, name: 'Twice', role: 'client' });
    expect(res.status).toBe(409);
    expect(res.body.error.field).toBe('email');
  });

  it('lets only one of several simultaneous invitations of the same address through', async () => {
    const admin = await signedInAgent(h.t.app, org.users.admin.email);
    const email = `${unique('twice')}@test.example`;
    const replies = await Promise.all(Array.from({ length: 5 }, () => admin.post('/api/invitations').send({ email, name: 'Once', role: 'client' })));
    expect(replies.map((r) => r.status).sort()).toEqual([202, 409, 409, 409, 409]);
    expect(await h.t.db('users').where({ email })).toHaveLength(1);
  });
});
