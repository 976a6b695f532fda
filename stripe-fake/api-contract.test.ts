import Stripe from 'stripe';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { sdkClient, startHarness, type Harness } from './testing/fake-stripe-harness';

let harness: Harness;
beforeEach(async () => {
  harness = await startHarness();
});
afterEach(() => harness.close());

describe('idempotency keys', () => {
  it('replays the first answer for the same key and parameters', async () => {
    const { stripe } = harness;
    const first = await stripe.customers.create({ email: 'same@glacier-lab.example' }, { idempotencyKey: 'key-1' });
    const again = await stripe.customers.create({ email: 'same@glacier-lab.example' }, { idempotencyKey: 'key-1' });
    expect(again.id).toBe(first.id);
    expect(again.lastResponse.headers['idempotent-replayed']).toBe('true');
    expect((await stripe.customers.list()).data).toHaveLength(1);
  });

  it('refuses the same key with other parameters with an idempotency error', async () => {
    const { stripe } = harness;
    await stripe.customers.create({ email: 'one@glacier-lab.example' }, { idempotencyKey: 'key-2' });
    const reuse = stripe.customers.create({ email: 'two@glacier-lab.example' }, { idempotencyKey: 'key-2' });
    await expect(reuse).rejects.toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
    await expect(reuse).rejects.toMatchObject({ statusCode: 400, type: 'StripeIdempotencyError' });
    expect((await stripe.customers.list()).data).toHaveLength(1);
  });

  it('gives every POST without a key of its own a fresh result', async () => {
    const { stripe } = harness;
    const a = await stripe.customers.create({ email: 'x@glacier-lab.example' });
    const b = await stripe.customers.create({ email: 'x@glacier-lab.example' });
    expect(a.id).not.toBe(b.id);
  });
});

describe('errors in the service shape', () => {
  it('reports a missing parameter as StripeInvalidRequestError naming it', async () => {
    const { stripe } = harness;
    const attempt = stripe.checkout.sessions.create({
      mode: 'subscription',
      success_url: 'http://127.0.0.1:3000/done',
    });
    await expect(attempt).rejects.toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    await expect(attempt).rejects.toMatchObject({
      statusCode: 400,
      code: 'parameter_missing',
      param: 'line_items',
      message: 'Missing required param: line_items.',
    });
  });

  it('names the bracketed parameter of a bad nested value', async () => {
    const [monthly] = (await harness.stripe.prices.list({ lookup_keys: ['seat_monthly'] })).data;
    const attempt = harness.stripe.checkout.sessions.create({
      mode: 'subscription',
      line_items: [{ price: monthly.id, quantity: 0 }],
      success_url: 'http://127.0.0.1:3000/done',
    });
    await expect(attempt).rejects.toMatchObject({ statusCode: 400, param: 'line_items[0][quantity]' });
  });

  it('rejects a parameter the fake does not model, as the service rejects unknown ones', async () => {
    const attempt = harness.stripe.customers.create({ email: 'a@b.example', preferred_locales: ['de'] });
    await expect(attempt).rejects.toMatchObject({
      type: 'StripeInvalidRequestError',
      code: 'parameter_unknown',
      param: 'preferred_locales',
    });
  });

  it('answers a missing object with 404 resource_missing', async () => {
    const attempt = harness.stripe.subscriptions.retrieve('sub_doesnotexist');
    await expect(attempt).rejects.toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    await expect(attempt).rejects.toMatchObject({
      statusCode: 404,
      code: 'resource_missing',
      message: "No such subscription: 'sub_doesnotexist'",
    });
  });

  it('answers an unknown customer named in a body with 400 and the parameter', async () => {
    const [monthly] = (await harness.stripe.prices.list({ lookup_keys: ['seat_monthly'] })).data;
    const attempt = harness.stripe.checkout.sessions.create({
      mode: 'subscription',
      customer: 'cus_missing',
      line_items: [{ price: monthly.id, quantity: 1 }],
      success_url: 'http://127.0.0.1:3000/done',
    });
    await expect(attempt).rejects.toMatchObject({ statusCode: 400, code: 'resource_missing', param: 'customer' });
  });

  it('requires a secret test key', async () => {
    const wrongKey = sdkClient(harness.fake.port, 'pk_test_public');
    await expect(wrongKey.customers.list()).rejects.toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
    const bare = await fetch(`${harness.fake.url}/v1/customers`);
    expect(bare.status).toBe(401);
    expect(((await bare.json()) as { error: { type: string } }).error.type).toBe('invalid_request_error');
  });

  it('answers an unknown API path with 404 in the error shape', async () => {
    const response = await fetch(`${harness.fake.url}/v1/payouts`, { headers: { Authorization: 'Bearer sk_test_x' } });
    expect(response.status).toBe(404);
    expect(await response.json()).toEqual({
      error: { type: 'invalid_request_error', message: 'Unrecognized request URL (GET: /v1/payouts).' },
    });
  });
});

describe('lists', () => {
  it('pages newest first with limit and starting_after, and auto-paginates in the SDK', async () => {
    const { stripe } = harness;
    const created = [];
    for (const n of [1, 2, 3]) created.push(await stripe.customers.create({ email: `c${n}@glacier-lab.example` }));
    const first = await stripe.customers.list({ limit: 2 });
    expect(first.data.map((c) => c.email)).toEqual(['c3@glacier-lab.example', 'c2@glacier-lab.example']);
    expect(first.has_more).toBe(true);
    const rest = await stripe.customers.list({ limit: 2, starting_after: first.data[1].id });
    expect(rest.data.map((c) => c.id)).toEqual([created[0].id]);
    expect(rest.has_more).toBe(false);
    const all = await stripe.customers.list({ limit: 1 }).autoPagingToArray({ limit: 10 });
    expect(all.map((c) => c.id)).toEqual(created.map((c) => c.id).reverse());
  });
});
