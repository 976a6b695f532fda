import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ACCEPTED_CARD } from '../../scripts/lib/paid-plan';
import { createOrganisation, signedInAgent, type TestOrg } from '../support/factories';
import { startTeamHarness, type TeamHarness } from '../support/team-harness';

let h: TeamHarness;

beforeAll(async () => {
  h = await startTeamHarness();
});
afterAll(() => h.close());

const sessionIdOf = (url: string) => url.split('/').pop()!;
const openSessionsOf = (org: TestOrg) =>
  h.fake.state.sessions.newestFirst((s) => s.metadata.organisation_id === String(org.organisationId) && s.status === 'open');
const liveSubscriptionsOf = (org: TestOrg) =>
  h.fake.state.subscriptions.newestFirst((s) => s.metadata.organisation_id === String(org.organisationId) && s.status === 'active');

describe('buying seats twice', () => {
  it('hands back the same open checkout to three checkouts in a row and to three at once', async () => {
    const org = await createOrganisation(h.t.db);
    const admin = await signedInAgent(h.t.app, org.users.admin.email);
    const order = { seats: 3, interval: 'monthly' };
    const inRow: string[] = [];
    for (let i = 0; i < 3; i++) {
      const res = await admin.post('/api/billing/checkout').send(order);
      expect(res.status).toBe(201);
      inRow.push(res.body.url);
    }
    const atOnce = await Promise.all(Array.from({ length: 3 }, () => admin.post('/api/billing/checkout').send(order)));
    expect(new Set([...inRow, ...atOnce.map((r) => r.body.url)]).size).toBe(1);
    expect(openSessionsOf(org)).toHaveLength(1);
  });

  it('closes the open checkout when another plan is chosen, so only one can be paid', async () => {
    const org = await createOrganisation(h.t.db);
    const admin = await signedInAgent(h.t.app, org.users.admin.email);
    const first = (await admin.post('/api/billing/checkout').send({ seats: 3, interval: 'monthly' })).body.url as string;
    const second = (await admin.post('/api/billing/checkout').send({ seats: 5, interval: 'yearly' })).body.url as string;
    expect(second).not.toBe(first);
    expect(openSessionsOf(org).map((s) => s.id)).toEqual([sessionIdOf(second)]);
    expect(() => h.fake.controls.completeCheckout(sessionIdOf(first), { cardNumber: ACCEPTED_CARD })).toThrow(/expired/);
  });

  it('leaves one paid subscription after paying twice: the second is cancelled and refunded at the service', async () => {
    const org = await createOrganisation(h.t.db);
    // Two sessions opened behind the checkout route's back (as if by two servers racing), both paid.
    const payer = { email: org.users.admin.email };
    const a = await h.t.ctx.billing.openCheckout(org.organisationId, payer, { seats: 2, interval: 'monthly' });
    const b = await h.t.ctx.billing.openCheckout(org.organisationId, payer, { seats: 2, interval: 'monthly' });
    const paidFirst = h.fake.controls.completeCheckout(a.id, { cardNumber: ACCEPTED_CARD });
    await h.fake.controls.whenWebhooksIdle();
    const paidSecond = h.fake.controls.completeCheckout(b.id, { cardNumber: ACCEPTED_CARD });
    await h.fake.controls.whenWebhooksIdle();

    expect(liveSubscriptionsOf(org).map((s) => s.id)).toEqual([paidFirst.subscription.id]);
    expect(h.fake.state.subscriptions.get(paidSecond.subscription.id)!.status).toBe('canceled');
    const [payment] = h.fake.state.invoicePayments.newestFirst((p) => p.invoice === paidSecond.invoice.id);
    const refunds = h.fake.state.refunds.newestFirst((r) => r.payment_intent === payment!.payment.payment_intent);
    expect(refunds).toHaveLength(1);
    expect(refunds[0]).toMatchObject({ amount: paidSecond.invoice.amount_paid, reason: 'duplicate' });
    const row = await h.t.db('subscriptions').where({ organisation_id: org.organisationId }).first();
    expect(row).toMatchObject({ subscription_ref: paidFirst.subscription.id, status: 'active' });
  });

  it('refuses a checkout once the plan is paid', async () => {
    const org = await createOrganisation(h.t.db);
    const admin = await signedInAgent(h.t.app, org.users.admin.email);
    const url = (await admin.post('/api/billing/checkout').send({ seats: 3, interval: 'monthly' })).body.url as string;
    h.fake.controls.completeCheckout(sessionIdOf(url), { cardNumber: ACCEPTED_CARD });
    await h.fake.controls.whenWebhooksIdle();
    const again = await admin.post('/api/billing/checkout').send({ seats: 3, interval: 'monthly' });
    expect(again.status).toBe(409);
    expect(await h.t.db('pending_checkouts').where({ organisation_id: org.organisationId }).first()).toBeUndefined();
  });
});
