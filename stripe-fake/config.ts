import { z } from 'zod';
import { FAKE_STRIPE_DEFAULTS } from './app';

/** The fake's environment, read once at start; a bad value stops it with a clear message. */
const envSchema = z.object({
  STRIPE_FAKE_PORT: z.coerce.number().int().min(0).max(65_535).default(12_111),
  STRIPE_FAKE_WEBHOOK_URL: z
    .union([z.url(), z.literal('off')])
    .default('http://127.0.0.1:3000/api/billing/webhook')
    .transform((value) => (value === 'off' ? null : value)),
  STRIPE_WEBHOOK_SECRET: z.string().startsWith('whsec_').default(FAKE_STRIPE_DEFAULTS.webhookSecret),
  /** When set, the one secret key the fake accepts; otherwise any `sk_test_…` key. */
  STRIPE_SECRET_KEY: z.string().startsWith(FAKE_STRIPE_DEFAULTS.keyPrefix).optional(),
  STRIPE_FAKE_RETRY_BASE_MS: z.coerce.number().int().min(0).default(FAKE_STRIPE_DEFAULTS.webhookRetryBaseMs),
});

export type FakeStripeEnv = z.infer<typeof envSchema>;

export function readFakeStripeEnv(env: NodeJS.ProcessEnv = process.env): FakeStripeEnv {
  const result = envSchema.safeParse(env);
  if (result.success) return result.data;
  const problems = result.error.issues.map((issue) => `${issue.path.join('.')}: ${issue.message}`).join('; ');
  throw new Error(`stripe-fake: bad environment — ${problems}`);
}
