import type Stripe from 'stripe';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import {
  DECLINED_CARD, SUCCESS_CARD, TEST_CLOCK_START, startHarness, type Harness,
} from './testing/fake-stripe-harness';

let harness: Harness;
beforeEach(async () => {
  harness = await startHarness();
});
afterEach(() => harness.close());

async function openSession(customerEmail?: string) {
  const { stripe } = harness;
  const [monthly] = (await stripe.prices.list({ lookup_keys: ['seat_monthly'] })).data;
  return stripe.checkout.sessions.create({
    mode: 'subscription',
    ...(customerEmail ? { customer_email: customerEmail } : {}),
    line_items: [{ price: monthly.id, quantity: 3 }],
    success_url: 'http://127.0.0.1:3000/billing/done?session={CHECKOUT_SESSION_ID}',
    cancel_url: 'http://127.0.0.1:3000/billing',
    client_reference_id: 'org_42',
    metadata: { organisation: 'org_42' },
  });
}

describe('catalog', () => {
  it('lists the seat prices by lookup key', async () => {
    const prices = await harness.stripe.prices.list({ lookup_keys: ['seat_monthly', 'seat_yearly'] });
    const byKey = Object.fromEntries(prices.data.map((price) => [price.lookup_key, price]));
    expect(Object.keys(byKey).sort()).toEqual(['seat_monthly', 'seat_yearly']);
    expect(byKey.seat_monthly.recurring?.interval).toBe('month');
    expect(byKey.seat_monthly.unit_amount).toBe(3900);
    expect(byKey.seat_yearly.recurring?.interval).toBe('year');
    expect(byKey.seat_yearly.unit_amount).toBe(39000);
    const product = await harness.stripe.products.retrieve(byKey.seat_monthly.product as string);
    expect(product.name).toBe('Tarnish seat');
    const onlyYearly = await harness.stripe.prices.list({ lookup_keys: ['seat_yearly'] });
    expect(onlyYearly.data.map((price) => price.lookup_key)).toEqual(['seat_yearly']);
  });
});

describe('customers', () => {
  it('creates, retrieves and updates a customer', async () => {
    const { stripe } = harness;
    const created = await stripe.customers.create({ email: 'a@b.example', name: 'Old name', metadata: { org: '7' } });
    expect(created.id).toMatch(/^cus_/);
    const updated = await stripe.customers.update(created.id, { name: 'New name', metadata: { org: '', tier: 'x' } });
    expect(updated.name).toBe('New name');
    expect(updated.metadata).toEqual({ tier: 'x' });
    const fetched = await stripe.customers.retrieve(created.id);
    expect(fetched).toMatchObject({ id: created.id, email: 'a@b.example', name: 'New name' });
    const cleared = await stripe.customers.update(created.id, { metadata: '' });
    expect(cleared.metadata).toEqual({});
  });
});

describe('checkout completed through the control API', () => {
  it('creates the subscription, a paid invoice and signed events', async () => {
    const { stripe, fake, receiver } = harness;
    const customer = await stripe.customers.create({ email: 'lead@glacier-lab.example' });
    const [monthly] = (await stripe.prices.list({ lookup_keys: ['seat_monthly'] })).data;
    const session = await stripe.checkout.sessions.create({
      mode: 'subscription',
      customer: customer.id,
      line_items: [{ price: monthly.id, quantity: 3 }],
      success_url: 'http://127.0.0.1:3000/billing/done?session={CHECKOUT_SESSION_ID}',
      client_reference_id: 'org_42',
      metadata: { organisation: 'org_42' },
    });
    expect(session.id).toMatch(/^cs_test_/);
    expect(session).toMatchObject({ status: 'open', payment_status: 'unpaid', amount_total: 11700, currency: 'eur' });
    expect(session.url).toBe(`${fake.url}/hosted/checkout/${session.id}`);

    const response = await fetch(`${fake.url}/_fake/checkout/sessions/${session.id}/complete`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ card_number: SUCCESS_CARD }),
    });
    expect(response.status).toBe(200);
    await fake.controls.whenWebhooksIdle();

    const done = await stripe.checkout.sessions.retrieve(session.id, { expand: ['subscription', 'line_items'] });
    expect(done).toMatchObject({ status: 'complete', payment_status: 'paid', customer: customer.id, client_reference_id: 'org_42' });
    expect(done.line_items?.data[0].quantity).toBe(3);
    const subscription = done.subscription as Stripe.Subscription;
    expect(subscription.id).toMatch(/^sub_/);
    expect(subscription.status).toBe('active');
    expect(subscription.items.data[0]).toMatchObject({ quantity: 3, price: { id: monthly.id } });
    expect(subscription.items.data[0].id).toMatch(/^si_/);
    expect(subscription.items.data[0].current_period_start).toBe(TEST_CLOCK_START);
    expect(subscription.items.data[0].current_period_end).toBe(Date.UTC(2026, 3, 2) / 1000);

    const listed = await stripe.subscriptions.list({ customer: customer.id });
    expect(listed.data.map((s) => s.id)).toEqual([subscription.id]);
    const invoices = await stripe.invoices.list({ customer: customer.id });
    expect(invoices.data).toHaveLength(1);
    const [invoice] = invoices.data;
    expect(invoice.id).toMatch(/^in_/);
    expect(invoice).toMatchObject({ status: 'paid', amount_due: 11700, amount_paid: 11700, currency: 'eur', billing_reason: 'subscription_create' });
    expect(invoice.parent?.subscription_details?.subscription).toBe(subscription.id);
    expect(invoice.hosted_invoice_url).toBe(`${fake.url}/hosted/invoices/${invoice.id}`);

    expect(receiver.events.map((event) => event.type)).toEqual([
      'customer.subscription.created',
      'invoice.paid',
      'checkout.session.completed',
    ]);
    const completed = receiver.events[2];
    expect(completed.id).toMatch(/^evt_/);
    expect(completed).toMatchObject({ object: 'event', livemode: false, api_version: '2026-10-28.endive' });
    expect(completed.data.object).toMatchObject({ id: session.id, subscription: subscription.id, client_reference_id: 'org_42' });
    expect(receiver.requests.every((request) => request.status === 200)).toBe(true);
  });

  it('answers a declined card with a card error and starts nothing', async () => {
    const { fake, stripe, receiver } = harness;
    const session = await openSession('new-lead@glacier-lab.example');
    const response = await fetch(`${fake.url}/_fake/checkout/sessions/${session.id}/complete`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ card_number: DECLINED_CARD }),
    });
    expect(response.status).toBe(402);
    expect(await response.json()).toEqual({
      error: { type: 'card_error', code: 'card_declined', decline_code: 'generic_decline', message: 'Your card was declined.' },
    });
    await fake.controls.whenWebhooksIdle();
    expect(receiver.events).toEqual([]);
    expect((await stripe.subscriptions.list({ status: 'all' })).data).toEqual([]);
    expect((await stripe.checkout.sessions.retrieve(session.id)).status).toBe('open');
  });
});

describe('hosted checkout page', () => {
  const form = (fields: Record<string, string>) => new URLSearchParams(fields).toString();

  it('shows a card form and, with the success card, redirects to success_url', async () => {
    const { fake, stripe } = harness;
    const session = await openSession();
    const page = await fetch(session.url!);
    const markup = await page.text();
    expect(page.status).toBe(200);
    expect(markup).toContain('name="card_number"');
    expect(markup).toContain('name="email"');
    expect(markup).toContain('117.00 EUR');
    expect(markup).not.toMatch(/<script|https?:\/\/(?!127\.0\.0\.1)/);

    const paid = await fetch(session.url!, {
      method: 'POST',
      redirect: 'manual',
      headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
      body: form({ email: 'buyer@glacier-lab.example', card_number: SUCCESS_CARD, expiry: '12 / 39', cvc: '123', name: 'Ana Vaddo' }),
    });
    expect(paid.status).toBe(303);
    expect(paid.headers.get('location')).toBe(`http://127.0.0.1:3000/billing/done?session=${session.id}`);
    await fake.controls.whenWebhooksIdle();
    const done = await stripe.checkout.sessions.retrieve(session.id);
    const customer = await stripe.customers.retrieve(done.customer as string);
    expect(customer).toMatchObject({ email: 'buyer@glacier-lab.example', name: 'Ana Vaddo' });
    const subscription = await stripe.subscriptions.retrieve(done.subscription as string);
    expect(subscription).toMatchObject({ status: 'active', customer: customer.id });
    expect(subscription.items.data[0].quantity).toBe(3);
  });

  it('shows a clear decline message for the declined card and creates no subscription', async () => {
    const { fake, stripe, receiver } = harness;
    const session = await openSession('buyer@glacier-lab.example');
    const declined = await fetch(session.url!, {
      method: 'POST',
      redirect: 'manual',
      headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
      body: form({ card_number: DECLINED_CARD, expiry: '12 / 39', cvc: '123' }),
    });
    expect(declined.status).toBe(402);
    const markup = await declined.text();
    expect(markup).toContain('Your card was declined. Nothing was charged and no plan was started.');
    await fake.controls.whenWebhooksIdle();
    expect(receiver.events).toEqual([]);
    expect((await stripe.subscriptions.list({ status: 'all' })).data).toEqual([]);
    expect((await stripe.customers.list()).data).toEqual([]);
  });

  it('refuses an expired card date before charging', async () => {
    const session = await openSession('buyer@glacier-lab.example');
    const response = await fetch(session.url!, {
      method: 'POST',
      headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
      body: form({ card_number: SUCCESS_CARD, expiry: '01 / 20', cvc: '123' }),
    });
    expect(response.status).toBe(400);
    expect(await response.text()).toContain('Enter the card expiry as MM / YY, in the future.');
    expect((await harness.stripe.checkout.sessions.retrieve(session.id)).status).toBe('open');
  });

  it('closes a session 24 hours after it opened', async () => {
    const { fake, stripe } = harness;
    const session = await openSession('buyer@glacier-lab.example');
    fake.controls.advanceClock(24 * 3600);
    expect(await stripe.checkout.sessions.retrieve(session.id)).toMatchObject({ status: 'expired', url: null });
    expect((await fetch(session.url!)).status).toBe(410);
    expect(() => fake.controls.completeCheckout(session.id, { cardNumber: SUCCESS_CARD })).toThrow(
      'This checkout session is expired and can no longer be paid.',
    );
  });
});
