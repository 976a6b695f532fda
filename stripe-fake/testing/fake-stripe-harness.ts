import Stripe from 'stripe';
import { startFakeStripe, type RunningFakeStripe } from '../start';
import { startWebhookReceiver, type WebhookReceiver } from './webhook-receiver';

export const TEST_WEBHOOK_SECRET = 'whsec_fake_stripe_tests';
/** 2 March 2026 00:00 UTC: a 31-day monthly period (to 2 April) keeps proration figures simple. */
export const TEST_CLOCK_START = Date.UTC(2026, 2, 2) / 1000;
export const SUCCESS_CARD = '4242 4242 4242 4242';
export const DECLINED_CARD = '4000 0000 0000 0002';

export interface Harness {
  fake: RunningFakeStripe;
  receiver: WebhookReceiver;
  stripe: Stripe;
  close(): Promise<void>;
}

/** The real SDK pointed at a fake on this port, as our server configures it. */
export function sdkClient(port: number, apiKey = 'sk_test_x'): Stripe {
  return new Stripe(apiKey, { host: '127.0.0.1', port, protocol: 'http', maxNetworkRetries: 0, telemetry: false });
}

/** The fake with a frozen clock, fast webhook retries, a verifying receiver and the real SDK. */
export async function startHarness(): Promise<Harness> {
  const receiver = await startWebhookReceiver(TEST_WEBHOOK_SECRET);
  const fake = await startFakeStripe({
    port: 0,
    webhookUrl: receiver.url,
    webhookSecret: TEST_WEBHOOK_SECRET,
    webhookRetryBaseMs: 5,
    webhookMaxAttempts: 4,
    clockStart: TEST_CLOCK_START,
  });
  const stripe = sdkClient(fake.port);
  return {
    fake,
    receiver,
    stripe,
    close: async () => {
      await fake.close();
      await receiver.close();
    },
  };
}

/** A customer who has bought `quantity` monthly seats through checkout with the success card. */
export async function subscribedCustomer(harness: Harness, quantity: number) {
  const { stripe, fake } = harness;
  const customer = await stripe.customers.create({ email: 'lead@glacier-lab.example', name: 'Vaddo Hydro Consult' });
  const [monthly] = (await stripe.prices.list({ lookup_keys: ['seat_monthly'] })).data;
  const session = await stripe.checkout.sessions.create({
    mode: 'subscription',
    customer: customer.id,
    line_items: [{ price: monthly.id, quantity }],
    success_url: 'http://127.0.0.1:3000/billing/done?session={CHECKOUT_SESSION_ID}',
    cancel_url: 'http://127.0.0.1:3000/billing',
  });
  const { subscription } = fake.controls.completeCheckout(session.id, { cardNumber: SUCCESS_CARD });
  await fake.controls.whenWebhooksIdle();
  return { customer, monthly, session, subscriptionId: subscription.id };
}
