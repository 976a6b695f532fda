import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import type Stripe from 'stripe';
import { startFakeStripe, type RunningFakeStripe } from '../../stripe-fake';
import { startMailCatcher, type MailCatcher } from '../../server/services/mail/mail-catcher';
import { buyPlanInFake } from '../../scripts/lib/paid-plan';
import { createTestApp, type TestApp } from './test-app';
import type { TestOrg } from './factories';

export const TEST_WEBHOOK_SECRET = 'whsec_tarnish_api_tests';

export interface TeamHarness {
  t: TestApp;
  fake: RunningFakeStripe;
  catcher: MailCatcher;
  /** Where the app listens (webhooks from the fake arrive here). */
  baseUrl: string;
  /** An active monthly plan with `seats` seats for this organisation, through checkout and webhooks. */
  subscribe(org: TestOrg, seats: number): Promise<string>;
  /** The service's current view of a subscription. */
  remote(subscriptionRef: string): Promise<Stripe.Subscription>;
  close(): Promise<void>;
}

/**
 * The app on a free port with the payment fake (free port, fast webhook retries) and a
 * mail catcher (free port) beside it; everything started here is stopped by close().
 */
export async function startTeamHarness(env: Record<string, string> = {}): Promise<TeamHarness> {
  const catcher = await startMailCatcher(0);
  const fake = await startFakeStripe({ port: 0, webhookSecret: TEST_WEBHOOK_SECRET, webhookRetryBaseMs: 20, webhookMaxAttempts: 4 });
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const t = createTestApp(
    {
      STRIPE_API_PORT: String(fake.port),
      STRIPE_WEBHOOK_SECRET: TEST_WEBHOOK_SECRET,
      SMTP_PORT: String(catcher.port),
      PUBLIC_URL: baseUrl,
      ...env,
    },
    { inbox: catcher },
  );
  server.on('request', t.app);
  fake.controls.setWebhookUrl(`${baseUrl}/api/billing/webhook`);
  return {
    t,
    fake,
    catcher,
    baseUrl,
    subscribe: (org, seats) => buyPlanInFake(t.ctx, fake, org.organisationId, org.users.admin.email, seats),
    remote: (ref) => t.ctx.payments.subscriptions.retrieve(ref),
    close: async () => {
      await fake.close();
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await t.close();
      await catcher.close();
    },
  };
}
