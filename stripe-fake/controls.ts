import { seedCatalog } from './catalog';
import type { FakeContext } from './context';
import { invalidState } from './errors';
import { clearState } from './store';
import { completeSession, type CompletedCheckout, type Payment } from './services/checkout';
import { collectInvoice } from './services/invoicing';
import { renewDueSubscriptions } from './services/subscriptions';
import type { Invoice, StripeEvent } from './types';
import type { DeliveryAttempt } from './webhooks/sender';

export interface ClockResult {
  now: number;
  /** Subscriptions that were renewed or ended on the way. */
  renewed: string[];
}

/** What tests and the development inbox may do beyond the service's own API. */
export interface FakeStripeControls {
  /** Pays a checkout session without a browser; throws a 402 card_error for a declined card. */
  completeCheckout(sessionId: string, payment: Payment): CompletedCheckout;
  /** Moves the billing clock forward and renews (or ends) every subscription whose period ran out. */
  advanceClock(seconds: number): ClockResult;
  /** Moves the clock to the end of this subscription's period and renews everything due. */
  renewSubscription(subscriptionId: string): ClockResult;
  /** Makes the next charge of a saved card fail (one customer's, or anyone's when omitted). */
  failNextCharge(customerId?: string): void;
  /** Charges an unpaid invoice again, as the service's payment retries do. */
  retryInvoice(invoiceId: string): Invoice;
  now(): number;
  /** Events in the order they happened. */
  events(): StripeEvent[];
  deliveries(): DeliveryAttempt[];
  webhookUrl(): string | null;
  setWebhookUrl(url: string | null): void;
  whenWebhooksIdle(): Promise<void>;
  /** Forgets everything, seeds the seat product and prices again, puts the clock back. */
  reset(): void;
}

export function createControls(ctx: FakeContext): FakeStripeControls {
  return {
    completeCheckout: (sessionId, payment) => completeSession(ctx, sessionId, payment),
    advanceClock(seconds) {
      ctx.clock.advance(seconds);
      return { renewed: renewDueSubscriptions(ctx), now: ctx.clock.now() };
    },
    renewSubscription(subscriptionId) {
      const subscription = ctx.state.subscriptions.find(subscriptionId);
      if (subscription.status === 'canceled') throw invalidState('This subscription has ended and cannot renew.');
      ctx.clock.advanceTo(subscription.current_period_end);
      return { renewed: renewDueSubscriptions(ctx), now: ctx.clock.now() };
    },
    failNextCharge(customerId) {
      if (customerId) ctx.state.customers.find(customerId, 'customer');
      ctx.state.failNextCharge.add(customerId ?? '*');
    },
    retryInvoice(invoiceId) {
      const invoice = ctx.state.invoices.find(invoiceId);
      if (invoice.status !== 'open') throw invalidState(`Invoice ${invoice.id} is ${invoice.status}, not open.`);
      return collectInvoice(ctx, invoice);
    },
    now: () => ctx.clock.now(),
    events: () => ctx.state.events.newestFirst().reverse(),
    deliveries: () => ctx.webhooks.attempts(),
    webhookUrl: () => ctx.webhooks.url(),
    setWebhookUrl: (url) => ctx.webhooks.setUrl(url),
    whenWebhooksIdle: () => ctx.webhooks.whenIdle(),
    reset() {
      ctx.webhooks.reset();
      clearState(ctx.state);
      ctx.clock.reset();
      seedCatalog(ctx.state, ctx.clock);
    },
  };
}
