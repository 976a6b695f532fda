import { allows } from '../../shared/access/capabilities';
import { ROLES } from '../../shared/schemas/auth';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createOrganisation, signedInAgent, unique, userIdOf, type TestOrg } from '../support/factories';
import { startTeamHarness, type TeamHarness } from '../support/team-harness';

let h: TeamHarness;
beforeAll(async () => {
  h = await startTeamHarness();
});
afterAll(() => h.close());

const invitee = (role: string) => ({ email: `${unique('new')}@test.example`, name: 'New Member', role });
const seatsOf = async (org: TestOrg) => (await (await signedInAgent(h.t.app, org.users.admin.email)).get('/api/members')).body.seats;

describe('seat limit', () => {
  it('lets exactly one of 20 concurrent invitations take the one free seat', async () => {
    const org = await createOrganisation(h.t.db);
    await h.subscribe(org, 4);
    const admin = await signedInAgent(h.t.app, org.users.admin.email);
    const replies = await Promise.all(Array.from({ length: 20 }, () => admin.post('/api/invitations').send(invitee('consultant'))));
    const statuses = replies.map((r) => r.status);
    expect(statuses.filter((s) => s === 202)).toHaveLength(1);
    expect(statuses.filter((s) => s === 409)).toHaveLength(19);
    const refused = replies.find((r) => r.status === 409)!;
    expect(refused.body.error).toMatchObject({ code: 'no_free_seat' });
    expect(refused.body.error.message).toContain('Add seats under Seats & billing');
    expect(await seatsOf(org)).toEqual({ paid: 4, inUse: 4, active: true });
  });

  it('invites clients without a seat, and refuses paid members without an active plan', async () => {
    const org = await createOrganisation(h.t.db);
    const admin = await signedInAgent(h.t.app, org.users.admin.email);
    const paid = await admin.post('/api/invitations').send(invitee('scientist'));
    expect(paid.status).toBe(402);
    expect(paid.body.error.code).toBe('subscription_required');
    const clientInvitee = invitee('client');
    const client = await admin.post('/api/invitations').send(clientInvitee);
    expect(client.status).toBe(202);
    expect(await h.t.db('users').where({ email: clientInvitee.email }).first('role', 'status')).toMatchObject({ role: 'client', status: 'invited' });
  });
});

describe('role changes and removal', () => {
  let org: TestOrg;
  beforeAll(async () => {
    org = await createOrganisation(h.t.db);
    await h.subscribe(org, 3);
  });

  it('needs a free seat to turn a client into a consultant', async () => {
    const admin = await signedInAgent(h.t.app, org.users.admin.email);
    const full = await admin.patch(`/api/members/${org.users.client.id}`).send({ role: 'consultant' });
    expect(full.status).toBe(409);
    expect(full.body.error.code).toBe('no_free_seat');
    expect((await admin.put('/api/billing/seats').send({ seats: 4 })).status).toBe(200);
    const ok = await admin.patch(`/api/members/${org.users.client.id}`).send({ role: 'consultant' });
    expect(ok.status).toBe(200);
    expect(ok.body.member.role).toBe('consultant');
    expect(await seatsOf(org)).toEqual({ paid: 4, inUse: 4, active: true });
  });

  it('turns a seat holder into a client freely, but never the admin themself', async () => {
    const admin = await signedInAgent(h.t.app, org.users.admin.email);
    expect((await admin.patch(`/api/members/${org.users.scientist.id}`).send({ role: 'client' })).status).toBe(200);
    const self = await admin.patch(`/api/members/${org.users.admin.id}`).send({ role: 'client' });
    expect(self.status).toBe(403);
    expect((await admin.patch(`/api/members/${org.users.scientist.id}`).send({ role: 'owner' })).status).toBe(422);
  });

  it('removes a member: their sessions end and their seat is free again', async () => {
    const consultant = await signedInAgent(h.t.app, org.users.consultant.email);
    expect((await consultant.get('/api/me')).status).toBe(200);
    const admin = await signedInAgent(h.t.app, org.users.admin.email);
    const before = await seatsOf(org);
    expect((await admin.delete(`/api/members/${org.users.consultant.id}`)).status).toBe(204);
    expect((await consultant.get('/api/me')).status).toBe(401);
    expect((await seatsOf(org)).inUse).toBe(before.inUse - 1);
    const listed = (await admin.get('/api/members')).body.members.find((m: { id: number }) => m.id === org.users.consultant.id);
    expect(listed.status).toBe('disabled');
    expect((await admin.delete(`/api/members/${org.users.admin.id}`)).status).toBe(403);
    // A removed member can be invited back: the same account returns as an invitation.
    const back = await admin.post('/api/invitations').send({ email: org.users.consultant.email, name: 'Back Again', role: 'scientist' });
    expect(back.status).toBe(202);
    expect(await h.t.db('users').where({ id: org.users.consultant.id }).first('status', 'role')).toMatchObject({ status: 'invited', role: 'scientist' });
    expect((await signedInAgent(h.t.app, org.users.consultant.email).catch((e: Error) => e)) instanceof Error).toBe(true);
  });

  it('removes a pending invitation entirely', async () => {
    const admin = await signedInAgent(h.t.app, org.users.admin.email);
    const pendingInvitee = invitee('client');
    expect((await admin.post('/api/invitations').send(pendingInvitee)).status).toBe(202);
    const id = await userIdOf(h.t.db, pendingInvitee.email);
    expect((await admin.delete(`/api/members/${id}`)).status).toBe(204);
    expect(await h.t.db('users').where({ id }).first()).toBeUndefined();
  });
});

describe('who may manage members', () => {
  it.each(ROLES.filter((r) => !allows(r, 'manageMembers')))('answers 403 to a %s', async (role) => {
    const org = await createOrganisation(h.t.db);
    const agent = await signedInAgent(h.t.app, org.users[role].email);
    expect((await agent.get('/api/members')).status).toBe(403);
    expect((await agent.patch(`/api/members/${org.users.client.id}`).send({ role: 'scientist' })).status).toBe(403);
    expect((await agent.delete(`/api/members/${org.users.client.id}`)).status).toBe(403);
    expect((await agent.post('/api/invitations').send(invitee('client'))).status).toBe(403);
    expect((await agent.post(`/api/invitations/${org.users.client.id}/resend`)).status).toBe(403);
  });

  it('answers 404 to an admin reaching into another organisation', async () => {
    const mine = await createOrganisation(h.t.db);
    const theirs = await createOrganisation(h.t.db);
    await h.subscribe(theirs, 5);
    const admin = await signedInAgent(h.t.app, mine.users.admin.email);
    const theirAdmin = await signedInAgent(h.t.app, theirs.users.admin.email);
    const theirInvitee = invitee('consultant');
    expect((await theirAdmin.post('/api/invitations').send(theirInvitee)).status).toBe(202);

    expect((await admin.get(`/api/members/${theirs.users.consultant.id}`)).status).toBe(404);
    expect((await admin.patch(`/api/members/${theirs.users.client.id}`).send({ role: 'client' })).status).toBe(404);
    expect((await admin.delete(`/api/members/${theirs.users.consultant.id}`)).status).toBe(404);
    expect((await admin.post(`/api/invitations/${await userIdOf(h.t.db, theirInvitee.email)}/resend`)).status).toBe(404);
    const untouched = await h.t.db('users').where({ id: theirs.users.consultant.id }).first('status');
    expect(untouched.status).toBe('active');
  });
});

describe('an organisation keeps an admin', () => {
  it('lets only one of two admins demote the other when both try at once', async () => {
    const org = await createOrganisation(h.t.db);
    await h.t.db('users').where({ id: org.users.consultant.id }).update({ role: 'admin' });
    const first = await signedInAgent(h.t.app, org.users.admin.email);
    const second = await signedInAgent(h.t.app, org.users.consultant.email);
    const answers = await Promise.all([
      first.patch(`/api/members/${org.users.consultant.id}`).send({ role: 'scientist' }),
      second.patch(`/api/members/${org.users.admin.id}`).send({ role: 'scientist' }),
    ]);
    expect(answers.map((a) => a.status).sort()).toEqual([200, 403]);
    const admins = await h.t.db('users').where({ organisation_id: org.organisationId, role: 'admin', status: 'active' });
    expect(admins).toHaveLength(1);
  });

  it('a demoted admin\'s open session can no longer remove members', async () => {
    const org = await createOrganisation(h.t.db);
    await h.t.db('users').where({ id: org.users.consultant.id }).update({ role: 'admin' });
    const first = await signedInAgent(h.t.app, org.users.admin.email);
    const second = await signedInAgent(h.t.app, org.users.consultant.email);
    expect((await first.patch(`/api/members/${org.users.consultant.id}`).send({ role: 'consultant' })).status).toBe(200);
    // The demoted admin's open page can no longer act as admin.
    const late = await second.delete(`/api/members/${org.users.admin.id}`);
    expect(late.status).toBe(403);
    expect((await h.t.db('users').where({ id: org.users.admin.id }).first()).status).toBe('active');
  });
});
