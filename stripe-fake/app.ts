import express, { type Express } from 'express';
import Stripe from 'stripe';
import { seedCatalog } from './catalog';
import { createClock } from './clock';
import type { FakeContext } from './context';
import { createControls, type FakeStripeControls } from './controls';
import { errorHandler, unknownRoute } from './errors';
import { newId } from './ids';
import { idempotency } from './middleware/idempotency';
import { requireApiKey } from './middleware/require-api-key';
import { catalogRoutes } from './routes/catalog';
import { checkoutSessionRoutes } from './routes/checkout-sessions';
import { controlRoutes } from './routes/control';
import { customerRoutes } from './routes/customers';
import { eventRoutes } from './routes/events';
import { hostedRoutes } from './routes/hosted';
import { invoiceRoutes } from './routes/invoices';
import { refundRoutes } from './routes/refunds';
import { subscriptionRoutes } from './routes/subscriptions';
import { createState, type FakeStripeState } from './store';
import { createWebhookSender } from './webhooks/sender';

export interface FakeStripeOptions {
  /** Where events are POSTed; null records them without sending. */
  webhookUrl?: string | null;
  webhookSecret?: string;
  /** Accept exactly this key; when absent, any key starting with `keyPrefix`. */
  apiKey?: string | null;
  keyPrefix?: string;
  /** The fake's own origin for page and PDF links; learnt from the first request when absent. */
  publicUrl?: string;
  /** Delay before the first webhook retry; later retries double it. */
  webhookRetryBaseMs?: number;
  webhookMaxAttempts?: number;
  /** Freezes the billing clock at this Unix time (it then moves only through the control API). */
  clockStart?: number;
}

export const FAKE_STRIPE_DEFAULTS = {
  webhookSecret: 'whsec_local_tarnish',
  keyPrefix: 'sk_test_',
  webhookRetryBaseMs: 1000,
  webhookMaxAttempts: 5,
} as const;

export interface FakeStripeApp {
  app: Express;
  state: FakeStripeState;
  controls: FakeStripeControls;
  context: FakeContext;
}

export function createFakeStripeApp(options: FakeStripeOptions = {}): FakeStripeApp {
  const context: FakeContext = {
    state: createState(),
    clock: createClock(options.clockStart),
    webhooks: createWebhookSender({
      url: options.webhookUrl ?? null,
      secret: options.webhookSecret ?? FAKE_STRIPE_DEFAULTS.webhookSecret,
      retryBaseMs: options.webhookRetryBaseMs ?? FAKE_STRIPE_DEFAULTS.webhookRetryBaseMs,
      maxAttempts: options.webhookMaxAttempts ?? FAKE_STRIPE_DEFAULTS.webhookMaxAttempts,
    }),
    publicUrl: options.publicUrl ?? '',
    apiVersion: Stripe.API_VERSION,
  };
  seedCatalog(context.state, context.clock);
  const controls = createControls(context);

  const app = express();
  // The SDK sends list filters as `lookup_keys[0]=…`; only the extended parser reads brackets.
  app.set('query parser', 'extended');
  app.disable('x-powered-by');
  app.use((req, res, next) => {
    if (!context.publicUrl) context.publicUrl = `${req.protocol}://${req.get('host')}`;
    res.set('Request-Id', newId('req'));
    next();
  });
  app.use(hostedRoutes(context));
  app.use(controlRoutes(controls));

  const api = express.Router();
  api.use(requireApiKey(options.apiKey ?? null, options.keyPrefix ?? FAKE_STRIPE_DEFAULTS.keyPrefix));
  api.use(express.urlencoded({ extended: true }));
  api.use((req, res, next) => {
    res.set('Stripe-Version', req.get('stripe-version') ?? context.apiVersion);
    next();
  });
  api.use(idempotency(context.state.idempotency));
  api.use(customerRoutes(context), catalogRoutes(context), checkoutSessionRoutes(context));
  api.use(subscriptionRoutes(context), invoiceRoutes(context), refundRoutes(context), eventRoutes(context));
  api.use(unknownRoute);
  app.use('/v1', api);
  app.use(errorHandler);

  return { app, state: context.state, controls, context };
}
