import type { FakeContext } from '../context';
import { invalidParam, invalidState } from '../errors';
import { newId } from '../ids';
import type { CheckoutSession, Invoice, Metadata, Subscription } from '../types';
import { chargeEnteredCard } from './cards';
import { createCustomer } from './customers';
import { emitEvent } from './events';
import { startSubscription } from './subscriptions';

/** Sessions stay open for 24 hours, the service's default. */
const SESSION_LIFETIME_SECONDS = 24 * 60 * 60;

export interface SessionRequest {
  mode: 'subscription';
  customer?: string;
  customer_email?: string;
  line_items: { price: string; quantity: number }[];
  success_url: string;
  cancel_url?: string;
  client_reference_id?: string;
  metadata?: Metadata | null;
  subscription_data?: { metadata?: Metadata | null };
}

export function createSession(ctx: FakeContext, request: SessionRequest): CheckoutSession {
  if (request.customer && request.customer_email) {
    throw invalidParam('customer_email', 'You may only specify one of these parameters: customer, customer_email.');
  }
  if (request.customer) ctx.state.customers.find(request.customer, 'customer');
  if (request.line_items.length !== 1) {
    throw invalidParam('line_items', 'The local fake sells a single seat price; send one line item.');
  }
  const [line] = request.line_items;
  const price = ctx.state.prices.find(line.price, 'line_items[0][price]');
  const now = ctx.clock.now();
  const id = newId('cs_test');
  ctx.state.sessionOrders.set(id, {
    price: price.id,
    quantity: line.quantity,
    subscriptionMetadata: { ...request.subscription_data?.metadata },
  });
  const amount = price.unit_amount * line.quantity;
  return ctx.state.sessions.add({
    id,
    object: 'checkout.session',
    amount_subtotal: amount,
    amount_total: amount,
    cancel_url: request.cancel_url ?? null,
    client_reference_id: request.client_reference_id ?? null,
    created: now,
    currency: price.currency,
    customer: request.customer ?? null,
    customer_details: null,
    customer_email: request.customer_email ?? null,
    expires_at: now + SESSION_LIFETIME_SECONDS,
    invoice: null,
    livemode: false,
    metadata: { ...request.metadata },
    mode: 'subscription',
    payment_method_types: ['card'],
    payment_status: 'unpaid',
    status: 'open',
    subscription: null,
    success_url: request.success_url,
    url: `${ctx.publicUrl}/hosted/checkout/${id}`,
  });
}

/** The session, marked expired once its time on the billing clock is up. */
export function currentSession(ctx: FakeContext, sessionId: string): CheckoutSession {
  const session = ctx.state.sessions.find(sessionId);
  if (session.status === 'open' && session.expires_at <= ctx.clock.now()) {
    Object.assign(session, { status: 'expired', url: null } satisfies Partial<CheckoutSession>);
  }
  return session;
}

/** The session, if it can still be paid. */
export function openSession(ctx: FakeContext, sessionId: string): CheckoutSession {
  const session = currentSession(ctx, sessionId);
  if (session.status !== 'open') {
    throw invalidState(`This checkout session is ${session.status} and can no longer be paid.`);
  }
  return session;
}

export interface Payment {
  cardNumber: string;
  email?: string;
  name?: string;
}

export interface CompletedCheckout {
  session: CheckoutSession;
  subscription: Subscription;
  invoice: Invoice;
}

/**
 * Pays the session with a card. A declined card throws a 402 card_error and changes
 * nothing; an accepted one creates the customer if needed, the subscription and its
 * paid first invoice, then completes the session.
 */
export function completeSession(ctx: FakeContext, sessionId: string, payment: Payment): CompletedCheckout {
  const session = openSession(ctx, sessionId);
  const existing = session.customer ? ctx.state.customers.get(session.customer) : undefined;
  const email = existing?.email ?? session.customer_email ?? payment.email?.trim() ?? null;
  if (!existing && !email) throw invalidParam('email', 'An e-mail address for the receipt is required.');
  const card = chargeEnteredCard(payment.cardNumber);

  const customer = existing ?? createCustomer(ctx, { email: email!, name: payment.name?.trim() || undefined });
  const paymentMethod = newId('pm');
  ctx.state.savedCards.set(customer.id, { paymentMethodId: paymentMethod, ...card });
  customer.invoice_settings.default_payment_method = paymentMethod;

  const order = ctx.state.sessionOrders.get(session.id)!;
  const subscription = startSubscription(ctx, {
    customer: customer.id,
    price: ctx.state.prices.get(order.price)!,
    quantity: order.quantity,
    metadata: { ...order.subscriptionMetadata },
    paymentMethod,
  });
  Object.assign(session, {
    status: 'complete',
    payment_status: 'paid',
    customer: customer.id,
    customer_details: { email: customer.email, name: customer.name },
    subscription: subscription.id,
    invoice: subscription.latest_invoice,
    url: null,
  } satisfies Partial<CheckoutSession>);
  emitEvent(ctx, 'checkout.session.completed', session);
  return { session, subscription, invoice: ctx.state.invoices.get(subscription.latest_invoice!)! };
}
