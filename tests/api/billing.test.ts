import { allows } from '../../shared/access/capabilities';
import { ROLES } from '../../shared/schemas/auth';
import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import cookieParser from 'cookie-parser';
import express from 'express';
import Stripe from 'stripe';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { errorHandler } from '../../server/middleware/error-handler';
import { requireActiveSubscription } from '../../server/middleware/require-active-subscription';
import { requireAuth } from '../../server/middleware/require-auth';
import { TenantScope } from '../../server/services/tenant-scope';
import { createOrganisation, signedInAgent, TEST_PASSWORD, type TestOrg } from '../support/factories';
import { grantActivePlan } from '../support/paid-plan';
import { startTeamHarness, TEST_WEBHOOK_SECRET, type TeamHarness } from '../support/team-harness';
import { createTestApp } from '../support/test-app';

const DECLINED_CARD = '4000 0000 0000 0002';
let h: TeamHarness;

beforeAll(async () => {
  h = await startTeamHarness();
});
afterAll(() => h.close());

const sessionIdOf = (url: string) => /\/hosted\/checkout\/([^/?]+)/.exec(url)![1]!;
const localRow = (org: TestOrg) => h.t.db('subscriptions').where({ organisation_id: org.organisationId }).first();

/** Events the fake recorded for this organisation's subscription, oldest first. */
async function eventsFor(subscriptionRef: string) {
  return h.fake.controls.events().filter((event) => JSON.stringify(event.data.object).includes(subscriptionRef));
}

function postEvent(payload: string, signature?: string) {
  const req = request(h.t.app).post('/api/billing/webhook').set('Content-Type', 'application/json');
  if (signature) req.set('Stripe-Signature', signature);
  return req.send(payload);
}

const sign = (payload: string, timestamp = Math.floor(Date.now() / 1000), secret = TEST_WEBHOOK_SECRET) =>
  Stripe.webhooks.generateTestHeaderString({ payload, secret, timestamp });

/** A subscription paid in the fake while webhooks are held back, so the test delivers them itself. */
async function paidWithoutWebhooks(org: TestOrg, seats: number): Promise<string> {
  h.fake.controls.setWebhookUrl(null);
  try {
    const session = await h.t.ctx.billing.openCheckout(org.organisationId, { email: org.users.admin.email }, { seats, interval: 'monthly' });
    return h.fake.controls.completeCheckout(session.id, { cardNumber: '4242 4242 4242 4242' }).subscription.id;
  } finally {
    h.fake.controls.setWebhookUrl(`${h.baseUrl}/api/billing/webhook`);
  }
}

describe('checkout', () => {
  it('turns a paid checkout into an active subscription with the seats bought, through the webhook', async () => {
    const org = await createOrganisation(h.t.db);
    const admin = await signedInAgent(h.t.app, org.users.admin.email);
    const started = await admin.post('/api/billing/checkout').send({ seats: 4, interval: 'monthly' });
    expect(started.status).toBe(201);
    expect(started.body.url).toMatch(/^http:\/\/127\.0\.0\.1:\d+\/hosted\/checkout\//);
    expect(await localRow(org)).toBeUndefined();

    h.fake.controls.completeCheckout(sessionIdOf(started.body.url), { cardNumber: '4242 4242 4242 4242' });
    await h.fake.controls.whenWebhooksIdle();

    const summary = await admin.get('/api/billing');
    expect(summary.status).toBe(200);
    expect(summary.body.subscription).toMatchObject({ status: 'active', seats: 4, interval: 'monthly', cancelAtPeriodEnd: false });
    expect(summary.body.seats).toEqual({ paid: 4, inUse: 3, active: true });
    expect(new Date(summary.body.subscription.currentPeriodEnd).getTime()).toBeGreaterThan(Date.now());
  });

  it('refuses a second plan while one is active, and fewer seats than members who need one', async () => {
    const org = await createOrganisation(h.t.db);
    const admin = await signedInAgent(h.t.app, org.users.admin.email);
    const tooFew = await admin.post('/api/billing/checkout').send({ seats: 2, interval: 'yearly' });
    expect(tooFew.status).toBe(409);
    expect(tooFew.body.error.message).toContain('buy at least 3 seats');
    await h.subscribe(org, 3);
    const again = await admin.post('/api/billing/checkout').send({ seats: 5, interval: 'monthly' });
    expect(again.status).toBe(409);
  });

  it('leaves no subscription when the card is declined', async () => {
    const org = await createOrganisation(h.t.db);
    const admin = await signedInAgent(h.t.app, org.users.admin.email);
    const started = await admin.post('/api/billing/checkout').send({ seats: 3, interval: 'monthly' });
    expect(() => h.fake.controls.completeCheckout(sessionIdOf(started.body.url), { cardNumber: DECLINED_CARD })).toThrow();
    await h.fake.controls.whenWebhooksIdle();
    expect(await localRow(org)).toBeUndefined();
    expect((await admin.get('/api/billing')).body).toMatchObject({ subscription: null, seats: { paid: 0, active: false } });
  });
});

describe('webhook signatures', () => {
  let org: TestOrg;
  let payload: string;

  beforeAll(async () => {
    org = await createOrganisation(h.t.db);
    const ref = await paidWithoutWebhooks(org, 3);
    const created = (await eventsFor(ref)).find((e) => e.type === 'customer.subscription.created')!;
    payload = JSON.stringify(created);
  });

  it('answers 400 and changes nothing without a signature', async () => {
    expect((await postEvent(payload)).status).toBe(400);
    expect(await localRow(org)).toBeUndefined();
  });

  it('answers 400 to a signature made with another secret', async () => {
    expect((await postEvent(payload, sign(payload, undefined, 'whsec_someone_else'))).status).toBe(400);
    expect(await localRow(org)).toBeUndefined();
  });

  it('answers 400 when one byte of the body changed after signing', async () => {
    const signature = sign(payload);
    const changed = payload.replace('"quantity":3', '"quantity":9');
    expect(changed).not.toBe(payload);
    expect((await postEvent(changed, signature)).status).toBe(400);
    expect(await localRow(org)).toBeUndefined();
  });

  it('answers 400 to a signature older than the five-minute tolerance', async () => {
    const res = await postEvent(payload, sign(payload, Math.floor(Date.now() / 1000) - 3600));
    expect(res.status).toBe(400);
    expect(await localRow(org)).toBeUndefined();
  });

  it('applies the same event once it is signed properly', async () => {
    const res = await postEvent(payload, sign(payload));
    expect(res.status).toBe(200);
    expect(await localRow(org)).toMatchObject({ status: 'active', seats: 3 });
  });
});

describe('duplicate and out-of-order events', () => {
  it('applies an event delivered 5 times in a row and 10 times at once only once', async () => {
    const org = await createOrganisation(h.t.db);
    const ref = await paidWithoutWebhooks(org, 3);
    const [created, paid] = (await eventsFor(ref)).filter((e) => e.type !== 'checkout.session.completed');

    const createdPayload = JSON.stringify(created);
    const serial = [];
    for (let i = 0; i < 5; i += 1) serial.push(await postEvent(createdPayload, sign(createdPayload)));
    expect(serial.map((r) => r.status)).toEqual([200, 200, 200, 200, 200]);
    expect(serial.map((r) => r.body.duplicate)).toEqual([false, true, true, true, true]);

    const paidPayload = JSON.stringify(paid);
    const parallel = await Promise.all(Array.from({ length: 10 }, () => postEvent(paidPayload, sign(paidPayload))));
    expect(parallel.every((r) => r.status === 200)).toBe(true);
    expect(parallel.filter((r) => r.body.duplicate === false)).toHaveLength(1);

    const stored = await h.t.db('payment_events').whereIn('id', [created!.id, paid!.id]).select('id');
    expect(stored).toHaveLength(2);
    const rows = await h.t.db('subscriptions').where({ organisation_id: org.organisationId });
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ status: 'active', seats: 3, subscription_ref: ref });
  });

  it('ends in the service’s current state when events arrive newest first', async () => {
    const org = await createOrganisation(h.t.db);
    const ref = await paidWithoutWebhooks(org, 3);
    h.fake.controls.setWebhookUrl(null);
    const remote = await h.remote(ref);
    await h.t.ctx.payments.subscriptions.update(ref, { items: [{ id: remote.items.data[0]!.id, quantity: 6 }] });
    await h.t.ctx.payments.subscriptions.cancel(ref);
    h.fake.controls.setWebhookUrl(`${h.baseUrl}/api/billing/webhook`);

    const events = await eventsFor(ref);
    expect(events.map((e) => e.type)).toEqual(expect.arrayContaining(['customer.subscription.created', 'customer.subscription.updated', 'customer.subscription.deleted']));
    for (const event of [...events].reverse()) {
      const body = JSON.stringify(event);
      expect((await postEvent(body, sign(body))).status).toBe(200);
    }
    expect(await localRow(org)).toMatchObject({ status: 'canceled', seats: 6 });
  });
});

describe('seat changes', () => {
  let org: TestOrg;
  let ref: string;

  beforeAll(async () => {
    org = await createOrganisation(h.t.db);
    ref = await h.subscribe(org, 4);
  });

  it('refuses to go below the seats in use, with a clear message, and changes nothing', async () => {
    const admin = await signedInAgent(h.t.app, org.users.admin.email);
    const res = await admin.put('/api/billing/seats').send({ seats: 2 });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toContain('cannot go below 3 seats');
    expect((await localRow(org)).seats).toBe(4);
    expect((await h.remote(ref)).items.data[0]!.quantity).toBe(4);
  });

  it('previews the prorated price of a seat change before anything changes, and charges what it showed', async () => {
    const admin = await signedInAgent(h.t.app, org.users.admin.email);
    const res = await admin.post('/api/billing/seats/preview').send({ seats: 6 });
    expect(res.status).toBe(200);
    const { preview } = res.body;
    expect(preview).toMatchObject({ seats: 6, currentSeats: 4, chargedNow: true, currency: 'eur' });
    // Two more seats for the rest of the period: more than nothing, at most two full-period seats.
    expect(preview.prorationAmount).toBeGreaterThan(0);
    expect(preview.prorationAmount).toBeLessThanOrEqual(2 * 3900);
    expect(preview.amountDue).toBe(preview.prorationAmount);
    expect((await h.remote(ref)).items.data[0]!.quantity).toBe(4);
    expect((await localRow(org)).seats).toBe(4);
    const fewer = (await admin.post('/api/billing/seats/preview').send({ seats: 3 })).body.preview;
    expect(fewer).toMatchObject({ chargedNow: false, seats: 3 });
    expect(fewer.prorationAmount).toBeLessThan(0);
    expect((await admin.post('/api/billing/seats/preview').send({ seats: 0 })).status).toBe(422);
  });

  it('adds seats at once and charges them on an invoice with a PDF link', async () => {
    const admin = await signedInAgent(h.t.app, org.users.admin.email);
    const res = await admin.put('/api/billing/seats').send({ seats: 7 });
    expect(res.status).toBe(200);
    expect(res.body.subscription).toMatchObject({ status: 'active', seats: 7 });
    expect((await h.remote(ref)).items.data[0]!.quantity).toBe(7);
    await h.fake.controls.whenWebhooksIdle();
    const invoices = await admin.get('/api/billing/invoices');
    expect(invoices.status).toBe(200);
    const reasons = invoices.body.invoices.map((i: { reason: string }) => i.reason);
    expect(reasons).toEqual(expect.arrayContaining(['subscription_create', 'subscription_update']));
    const first = invoices.body.invoices.find((i: { reason: string }) => i.reason === 'subscription_create');
    expect(first).toMatchObject({ amountDue: 4 * 3900, currency: 'eur', status: 'paid' });
    expect(first.pdfUrl).toMatch(/\/hosted\/invoices\/[^/]+\/pdf$/);
  });

  it('lowers seats down to the seats in use', async () => {
    const admin = await signedInAgent(h.t.app, org.users.admin.email);
    const res = await admin.put('/api/billing/seats').send({ seats: 3 });
    expect(res.status).toBe(200);
    expect((await localRow(org)).seats).toBe(3);
  });

  it('cancels at the end of the period and takes that back', async () => {
    const admin = await signedInAgent(h.t.app, org.users.admin.email);
    const cancelled = await admin.post('/api/billing/cancel');
    expect(cancelled.body.subscription).toMatchObject({ status: 'active', cancelAtPeriodEnd: true });
    expect((await h.remote(ref)).cancel_at_period_end).toBe(true);
    const resumed = await admin.post('/api/billing/resume');
    expect(resumed.body.subscription).toMatchObject({ status: 'active', cancelAtPeriodEnd: false });
  });
});

describe('payment service down', () => {
  it('answers 503 with a clear message and changes nothing here', async () => {
    const org = await createOrganisation(h.t.db);
    await h.subscribe(org, 4);
    const closed = createServer();
    await new Promise<void>((resolve) => closed.listen(0, '127.0.0.1', resolve));
    const deadPort = (closed.address() as AddressInfo).port;
    await new Promise<void>((resolve) => closed.close(() => resolve()));

    const cut = createTestApp({ STRIPE_API_PORT: String(deadPort), STRIPE_WEBHOOK_SECRET: TEST_WEBHOOK_SECRET });
    try {
      const admin = await signedInAgent(cut.app, org.users.admin.email);
      const before = await localRow(org);
      const resize = await admin.put('/api/billing/seats').send({ seats: 6 });
      expect(resize.status).toBe(503);
      expect(resize.body.error).toMatchObject({ code: 'upstream_unavailable' });
      expect(resize.body.error.message).toContain('payment service cannot be reached');
      expect(await localRow(org)).toEqual(before);

      // A webhook that cannot be checked against the service is refused unrecorded, so the fake sends it again.
      const late = await createOrganisation(cut.db);
      const ref = await paidWithoutWebhooks(late, 3);
      const event = (await eventsFor(ref)).find((e) => e.type === 'customer.subscription.created')!;
      const body = JSON.stringify(event);
      const refused = await request(cut.app).post('/api/billing/webhook').set('Content-Type', 'application/json').set('Stripe-Signature', sign(body)).send(body);
      expect(refused.status).toBe(503);
      expect(await h.t.db('payment_events').where({ id: event.id }).first()).toBeUndefined();
      expect(await localRow(late)).toBeUndefined();
      expect((await postEvent(body, sign(body))).status).toBe(200);
      expect(await localRow(late)).toMatchObject({ status: 'active', seats: 3 });

      const other = await createOrganisation(cut.db);
      const otherAdmin = await signedInAgent(cut.app, other.users.admin.email);
      expect((await otherAdmin.post('/api/billing/checkout').send({ seats: 3, interval: 'monthly' })).status).toBe(503);
      expect(await localRow(other)).toBeUndefined();
    } finally {
      await cut.close();
    }
  });
});

describe('who may reach billing', () => {
  it.each(ROLES.filter((r) => !allows(r, 'manageSeats')))('answers 403 to a %s on every billing route', async (role) => {
    const org = await createOrganisation(h.t.db);
    const agent = await signedInAgent(h.t.app, org.users[role].email);
    expect((await agent.get('/api/billing')).status).toBe(403);
    expect((await agent.get('/api/billing/invoices')).status).toBe(403);
    expect((await agent.post('/api/billing/checkout').send({ seats: 3, interval: 'monthly' })).status).toBe(403);
    expect((await agent.put('/api/billing/seats').send({ seats: 9 })).status).toBe(403);
    expect((await agent.post('/api/billing/cancel')).status).toBe(403);
  });

  it('shows each admin only their own organisation’s plan and invoices', async () => {
    const paying = await createOrganisation(h.t.db);
    await h.subscribe(paying, 5);
    const other = await createOrganisation(h.t.db);
    const otherAdmin = await signedInAgent(h.t.app, other.users.admin.email);
    expect((await otherAdmin.get('/api/billing')).body.subscription).toBeNull();
    expect((await otherAdmin.get('/api/billing/invoices')).body.invoices).toEqual([]);
    expect((await otherAdmin.post('/api/billing/cancel')).status).toBe(404);
    expect((await localRow(paying)).cancel_at_period_end).toBeFalsy();
  });
});

describe('paid-feature guard', () => {
  it('lets requests through requireActiveSubscription only with an active plan', async () => {
    const org = await createOrganisation(h.t.db);
    const app = express();
    app.use(cookieParser());
    app.post('/paid', requireAuth(h.t.ctx), requireActiveSubscription(h.t.ctx), (_req, res) => void res.json({ started: true }));
    app.use(errorHandler);
    const cookie = (await request(h.t.app).post('/api/auth/sign-in').send({ email: org.users.scientist.email, password: TEST_PASSWORD }))
      .headers['set-cookie'];
    const refused = await request(app).post('/paid').set('Cookie', cookie);
    expect(refused.status).toBe(402);
    expect(refused.body.error.code).toBe('subscription_required');
    await grantActivePlan(h.t.db, org.organisationId);
    expect((await request(app).post('/paid').set('Cookie', cookie)).body).toEqual({ started: true });
    await h.t.db('subscriptions').where({ organisation_id: org.organisationId }).update({ status: 'past_due' });
    expect((await request(app).post('/paid').set('Cookie', cookie)).status).toBe(402);
  });

  it('refuses paid features without an active plan and allows them with one', async () => {
    const org = await createOrganisation(h.t.db);
    const scope = new TenantScope(h.t.db, org.organisationId);
    await expect(h.t.ctx.billing.assertCanUsePaidFeatures(scope)).rejects.toMatchObject({ status: 402, code: 'subscription_required' });
    await h.subscribe(org, 3);
    await expect(h.t.ctx.billing.assertCanUsePaidFeatures(scope)).resolves.toBeUndefined();
  });
});
