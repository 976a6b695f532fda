import { createServer } from 'node:net';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import {
  sdkClient, startHarness, subscribedCustomer, TEST_WEBHOOK_SECRET, type Harness,
} from './testing/fake-stripe-harness';
import { startFakeStripe } from './start';
import { retryDelayMs } from './webhooks/sender';

let harness: Harness;
beforeEach(async () => {
  harness = await startHarness();
});
afterEach(() => harness.close());

/** A port that refuses connections: bound, then released. */
async function closedPort(): Promise<number> {
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as { port: number };
  await new Promise((resolve) => server.close(resolve));
  return port;
}

describe('webhook delivery', () => {
  it('retries an event the receiver first answers with 500 until it is accepted', async () => {
    const { fake, receiver, stripe } = harness;
    const { subscriptionId } = await subscribedCustomer(harness, 1);
    receiver.failNext(2);
    await stripe.subscriptions.cancel(subscriptionId);
    await fake.controls.whenWebhooksIdle();

    const deleted = fake.controls.events().at(-1)!;
    expect(deleted.type).toBe('customer.subscription.deleted');
    const attempts = fake.controls.deliveries().filter((attempt) => attempt.event === deleted.id);
    expect(attempts.map((attempt) => [attempt.attempt, attempt.status, attempt.ok])).toEqual([
      [1, 500, false],
      [2, 500, false],
      [3, 200, true],
    ]);
    // Accepted once, with a valid signature each time it was tried.
    expect(receiver.events.filter((event) => event.id === deleted.id)).toHaveLength(1);
    expect(receiver.requests.filter((request) => request.type === 'customer.subscription.deleted').map((r) => r.status))
      .toEqual([500, 500, 200]);

    const listed = (await fetch(`${fake.url}/_fake/deliveries?settled=true`).then((r) => r.json())) as { data: unknown[] };
    expect(listed.data).toHaveLength(fake.controls.deliveries().length);
  });

  it('waits twice as long before each further retry', () => {
    expect([1, 2, 3, 4].map((attempt) => retryDelayMs(250, attempt))).toEqual([250, 500, 1000, 2000]);
  });

  it('gives up after the configured number of attempts when nobody listens', async () => {
    const fake = await startFakeStripe({
      webhookUrl: `http://127.0.0.1:${await closedPort()}/webhook`,
      webhookSecret: TEST_WEBHOOK_SECRET,
      webhookRetryBaseMs: 2,
      webhookMaxAttempts: 3,
    });
    try {
      const stripe = sdkClient(fake.port);
      const customer = await stripe.customers.create({ email: 'a@b.example' });
      const [monthly] = (await stripe.prices.list({ lookup_keys: ['seat_monthly'] })).data;
      const session = await stripe.checkout.sessions.create({
        mode: 'subscription',
        customer: customer.id,
        line_items: [{ price: monthly.id, quantity: 2 }],
        success_url: 'http://127.0.0.1:3000/done',
      });
      fake.controls.completeCheckout(session.id, { cardNumber: '4242424242424242' });
      await fake.controls.whenWebhooksIdle();
      const attempts = fake.controls.deliveries();
      expect(attempts).toHaveLength(3 * fake.controls.events().length);
      expect(attempts.every((attempt) => attempt.status === null && attempt.error === 'ECONNREFUSED')).toBe(true);
      expect(Math.max(...attempts.map((attempt) => attempt.attempt))).toBe(3);
    } finally {
      await fake.close();
    }
  });

  it('sends events in the service shape, signed with the configured secret', async () => {
    const { fake, receiver } = harness;
    await subscribedCustomer(harness, 1);
    const [created] = receiver.events;
    expect(created.type).toBe('customer.subscription.created');
    expect(Object.keys(created).sort()).toEqual(
      ['api_version', 'created', 'data', 'id', 'livemode', 'object', 'pending_webhooks', 'request', 'type'],
    );
    expect(created.data.object).toMatchObject({ object: 'subscription', status: 'active' });
    const listed = (await fetch(`${fake.url}/_fake/events`).then((r) => r.json())) as { data: { id: string }[] };
    expect(listed.data.map((event) => event.id)).toEqual(receiver.events.map((event) => event.id));
    const retrieved = await harness.stripe.events.retrieve(created.id);
    expect(retrieved.type).toBe('customer.subscription.created');
  });

  it('can be pointed at another receiver at run time and reset', async () => {
    const { fake } = harness;
    const changed = await fetch(`${fake.url}/_fake/webhook`, {
      method: 'PUT',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ url: null }),
    });
    expect(await changed.json()).toEqual({ url: null });
    await subscribedCustomer(harness, 1);
    expect(harness.receiver.requests).toEqual([]);
    expect(fake.controls.events()).toHaveLength(3);

    const reset = await fetch(`${fake.url}/_fake/reset`, { method: 'POST' });
    expect(reset.status).toBe(200);
    expect(fake.controls.events()).toEqual([]);
    expect((await harness.stripe.customers.list()).data).toEqual([]);
    expect((await harness.stripe.prices.list({ lookup_keys: ['seat_monthly'] })).data).toHaveLength(1);
  });
});
