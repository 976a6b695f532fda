import type Stripe from 'stripe';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { startHarness, subscribedCustomer, TEST_CLOCK_START, type Harness } from './testing/fake-stripe-harness';

const DAY = 86_400;
const PERIOD_END = Date.UTC(2026, 3, 2) / 1000; // 2 April 2026: one month after TEST_CLOCK_START

let harness: Harness;
beforeEach(async () => {
  harness = await startHarness();
});
afterEach(() => harness.close());

const eventTypes = () => harness.receiver.events.map((event) => event.type);

describe('seat count changes', () => {
  it('invoices the proration at once with always_invoice and announces the update', async () => {
    const { stripe, fake, receiver } = harness;
    const { customer, subscriptionId } = await subscribedCustomer(harness, 3);
    const before = await stripe.subscriptions.retrieve(subscriptionId);
    fake.controls.advanceClock(10 * DAY);
    receiver.events.length = 0;

    const updated = await stripe.subscriptions.update(subscriptionId, {
      items: [{ id: before.items.data[0].id, quantity: 5 }],
      proration_behavior: 'always_invoice',
    });
    await fake.controls.whenWebhooksIdle();
    expect(updated.items.data[0].quantity).toBe(5);

    // 21 of the period's 31 days remain: credit 3 seats, charge 5, each 39.00 EUR × 21/31.
    // 3900 × 3 × 21/31 = 7925.81 → 7926; 3900 × 5 × 21/31 = 13209.68 → 13210.
    const [proration] = (await stripe.invoices.list({ subscription: subscriptionId, limit: 1 })).data;
    expect(proration.billing_reason).toBe('subscription_update');
    expect(proration.lines.data.map((line) => line.amount)).toEqual([-7926, 13210]);
    expect(proration).toMatchObject({ total: 5284, amount_due: 5284, amount_paid: 5284, status: 'paid' });

    expect(eventTypes()).toEqual(['customer.subscription.updated', 'invoice.paid']);
    const update = receiver.events[0];
    expect((update.data.object as Stripe.Subscription).items.data[0].quantity).toBe(5);
    expect(update.data.previous_attributes).toMatchObject({ items: { data: [{ quantity: 3 }] } });
    expect(customer.id).toBe(proration.customer);
  });

  it('previews the charge of a seat change with invoices.createPreview, changing nothing', async () => {
    const { stripe, fake } = harness;
    const { subscriptionId } = await subscribedCustomer(harness, 3);
    const before = await stripe.subscriptions.retrieve(subscriptionId);
    fake.controls.advanceClock(10 * DAY);
    const invoicesBefore = (await stripe.invoices.list({ subscription: subscriptionId })).data.length;
    const item = { id: before.items.data[0].id, quantity: 5 };
    const preview = await stripe.invoices.createPreview({
      subscription: subscriptionId, subscription_details: { items: [item], proration_behavior: 'always_invoice' },
    });
    // The same prorations the change itself charges (see the test above): 21 of 31 days, −7926 + 13210.
    expect(preview.lines.data.map((line) => line.amount)).toEqual([-7926, 13210]);
    expect(preview).toMatchObject({ object: 'invoice', total: 5284, amount_due: 5284, status: 'draft', number: null, billing_reason: 'subscription_update' });
    // The next renewal with fewer seats: the credit for the unused time and two seats for the next period.
    const renewal = await stripe.invoices.createPreview({ subscription: subscriptionId, subscription_details: { items: [{ ...item, quantity: 2 }] } });
    expect(renewal.billing_reason).toBe('subscription_cycle');
    expect(renewal.lines.data.map((line) => line.amount)).toEqual([-7926, 5284, 7800]);
    expect((await stripe.subscriptions.retrieve(subscriptionId)).items.data[0].quantity).toBe(3);
    expect((await stripe.invoices.list({ subscription: subscriptionId })).data).toHaveLength(invoicesBefore);
    await expect(stripe.invoices.createPreview({ subscription: 'sub_doesnotexist' })).rejects.toMatchObject({ statusCode: 404 });
  });

  it('keeps create_prorations lines for the next period invoice', async () => {
    const { stripe, fake } = harness;
    const { subscriptionId } = await subscribedCustomer(harness, 3);
    fake.controls.advanceClock(10 * DAY);
    await stripe.subscriptions.update(subscriptionId, { items: [{ quantity: 2 }] });
    expect((await stripe.invoices.list({ subscription: subscriptionId })).data).toHaveLength(1);

    const result = fake.controls.renewSubscription(subscriptionId);
    expect(result).toEqual({ now: PERIOD_END, renewed: [subscriptionId] });
    const [renewal] = (await stripe.invoices.list({ subscription: subscriptionId, limit: 1 })).data;
    // Credit 3900 × 3 × 21/31 → -7926, charge 3900 × 2 × 21/31 = 5283.87 → 5284, then 2 seats for April.
    expect(renewal.lines.data.map((line) => line.amount)).toEqual([-7926, 5284, 7800]);
    expect(renewal).toMatchObject({ billing_reason: 'subscription_cycle', total: 5158, amount_paid: 5158, status: 'paid' });
    expect(renewal.period_start).toBe(PERIOD_END);
  });

  it('turns a downgrade invoice into customer credit used by the next invoice', async () => {
    const { stripe, fake } = harness;
    const { customer, subscriptionId } = await subscribedCustomer(harness, 3);
    await stripe.subscriptions.update(subscriptionId, { items: [{ quantity: 1 }], proration_behavior: 'always_invoice' });
    // On the first day the whole month is left: credit 3 × 3900, charge 1 × 3900.
    const [downgrade] = (await stripe.invoices.list({ subscription: subscriptionId, limit: 1 })).data;
    expect(downgrade).toMatchObject({ total: -7800, amount_due: 0, ending_balance: -7800 });
    expect((await stripe.customers.retrieve(customer.id)) as Stripe.Customer).toMatchObject({ balance: -7800 });

    fake.controls.renewSubscription(subscriptionId);
    const [renewal] = (await stripe.invoices.list({ subscription: subscriptionId, limit: 1 })).data;
    expect(renewal).toMatchObject({ total: 3900, starting_balance: -7800, amount_due: 0, ending_balance: -3900 });
  });
});

describe('renewals and failed payments', () => {
  it('renews a period with a paid invoice and invoice.paid', async () => {
    const { stripe, fake } = harness;
    const { subscriptionId } = await subscribedCustomer(harness, 2);
    harness.receiver.events.length = 0;
    fake.controls.advanceClock(31 * DAY);
    await fake.controls.whenWebhooksIdle();
    const renewed = await stripe.subscriptions.retrieve(subscriptionId);
    expect(renewed.items.data[0].current_period_start).toBe(PERIOD_END);
    expect(renewed.items.data[0].current_period_end).toBe(Date.UTC(2026, 4, 2) / 1000);
    expect(eventTypes()).toEqual(['customer.subscription.updated', 'invoice.paid']);
    const invoice = harness.receiver.events[1].data.object as Stripe.Invoice;
    expect(invoice).toMatchObject({ amount_paid: 7800, billing_reason: 'subscription_cycle' });
  });

  it('fails the next charge on request: invoice.payment_failed and past_due, then recovers on retry', async () => {
    const { stripe, fake } = harness;
    const { customer, subscriptionId } = await subscribedCustomer(harness, 2);
    harness.receiver.events.length = 0;
    const armed = await fetch(`${fake.url}/_fake/charges/fail-next`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ customer: customer.id }),
    });
    expect(armed.status).toBe(200);
    const renewal = await fetch(`${fake.url}/_fake/subscriptions/${subscriptionId}/renew`, { method: 'POST' });
    expect(await renewal.json()).toEqual({ now: PERIOD_END, renewed: [subscriptionId] });
    await fake.controls.whenWebhooksIdle();

    expect(eventTypes()).toEqual(['customer.subscription.updated', 'invoice.payment_failed', 'customer.subscription.updated']);
    const [unpaid] = (await stripe.invoices.list({ subscription: subscriptionId, status: 'open' })).data;
    expect(unpaid).toMatchObject({ amount_due: 7800, amount_paid: 0, attempt_count: 1 });
    expect((await stripe.subscriptions.retrieve(subscriptionId)).status).toBe('past_due');

    fake.controls.retryInvoice(unpaid.id);
    expect((await stripe.invoices.retrieve(unpaid.id)).status).toBe('paid');
    expect((await stripe.subscriptions.retrieve(subscriptionId)).status).toBe('active');
  });

  it('raises StripeCardError for error_if_incomplete when the card fails, changing nothing', async () => {
    const { stripe, fake } = harness;
    const { subscriptionId } = await subscribedCustomer(harness, 2);
    fake.controls.failNextCharge();
    const attempt = stripe.subscriptions.update(subscriptionId, {
      items: [{ quantity: 4 }],
      proration_behavior: 'always_invoice',
      payment_behavior: 'error_if_incomplete',
    });
    await expect(attempt).rejects.toMatchObject({ type: 'StripeCardError', statusCode: 402, code: 'card_declined' });
    expect((await stripe.subscriptions.retrieve(subscriptionId)).items.data[0].quantity).toBe(2);
    expect((await stripe.invoices.list({ subscription: subscriptionId })).data).toHaveLength(1);
  });
});

describe('cancellation', () => {
  it('cancels at period end: updated now, deleted when the period ends', async () => {
    const { stripe, fake } = harness;
    const { subscriptionId } = await subscribedCustomer(harness, 2);
    harness.receiver.events.length = 0;
    const scheduled = await stripe.subscriptions.update(subscriptionId, { cancel_at_period_end: true });
    expect(scheduled).toMatchObject({ status: 'active', cancel_at_period_end: true, cancel_at: PERIOD_END, canceled_at: TEST_CLOCK_START });

    fake.controls.advanceClock(40 * DAY);
    await fake.controls.whenWebhooksIdle();
    const ended = await stripe.subscriptions.retrieve(subscriptionId);
    expect(ended).toMatchObject({ status: 'canceled', ended_at: PERIOD_END });
    expect(eventTypes()).toEqual(['customer.subscription.updated', 'customer.subscription.deleted']);
    expect(harness.receiver.events[0].data.previous_attributes).toMatchObject({ cancel_at_period_end: false });
    expect((await stripe.invoices.list({ subscription: subscriptionId })).data).toHaveLength(1);
    expect((await stripe.subscriptions.list()).data).toEqual([]);
    expect((await stripe.subscriptions.list({ status: 'canceled' })).data.map((s) => s.id)).toEqual([subscriptionId]);
  });

  it('cancels at once with subscriptions.cancel', async () => {
    const { stripe, fake } = harness;
    const { subscriptionId } = await subscribedCustomer(harness, 2);
    harness.receiver.events.length = 0;
    const canceled = await stripe.subscriptions.cancel(subscriptionId);
    await fake.controls.whenWebhooksIdle();
    expect(canceled).toMatchObject({ status: 'canceled', ended_at: TEST_CLOCK_START });
    expect(eventTypes()).toEqual(['customer.subscription.deleted']);
    await expect(stripe.subscriptions.update(subscriptionId, { items: [{ quantity: 3 }] })).rejects.toMatchObject({
      type: 'StripeInvalidRequestError',
    });
  });
});
