import { pathToFileURL } from 'node:url';
import { readFakeStripeEnv } from './config';
import { startFakeStripe } from './start';

export { createFakeStripeApp, FAKE_STRIPE_DEFAULTS, type FakeStripeApp, type FakeStripeOptions } from './app';
export { startFakeStripe, type RunningFakeStripe, type StartOptions } from './start';
export type { FakeStripeControls } from './controls';

async function main(): Promise<void> {
  const env = readFakeStripeEnv();
  const fake = await startFakeStripe({
    port: env.STRIPE_FAKE_PORT,
    webhookUrl: env.STRIPE_FAKE_WEBHOOK_URL,
    webhookSecret: env.STRIPE_WEBHOOK_SECRET,
    apiKey: env.STRIPE_SECRET_KEY ?? null,
    webhookRetryBaseMs: env.STRIPE_FAKE_RETRY_BASE_MS,
  });
  console.log(`stripe-fake listening on ${fake.url}; webhooks to ${env.STRIPE_FAKE_WEBHOOK_URL ?? '(off)'}`);
  const stop = () => void fake.close().then(() => process.exit(0));
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

// Importing this module (for startFakeStripe) must not start a second fake.
if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  main().catch((error: unknown) => {
    console.error(error instanceof Error ? error.message : error);
    process.exit(1);
  });
}
