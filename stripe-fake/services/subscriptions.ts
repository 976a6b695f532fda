import { addInterval } from '../clock';
import type { FakeContext } from '../context';
import { invalidParam, invalidState, noSuch } from '../errors';
import { newId } from '../ids';
import { applyMetadataChanges } from '../metadata';
import type { Metadata, Price, Subscription } from '../types';
import { cardError } from './cards';
import { emitEvent, previousAttributes } from './events';
import { amountDueAfterCredit, collectInvoice, createInvoice, previewInvoice, savedCardChargeFails, seatLine, type PreviewInvoice } from './invoicing';
import { quantityProrationLines } from './prorations';

export interface NewSubscription {
  customer: string;
  price: Price;
  quantity: number;
  metadata: Metadata;
  paymentMethod: string;
}

/** An active subscription paid by the card just accepted at checkout, with its first invoice. */
export function startSubscription(ctx: FakeContext, input: NewSubscription): Subscription {
  const now = ctx.clock.now();
  const end = addInterval(now, input.price.recurring.interval);
  const id = newId('sub');
  const subscription: Subscription = {
    id,
    object: 'subscription',
    billing_cycle_anchor: now,
    cancel_at: null,
    cancel_at_period_end: false,
    canceled_at: null,
    cancellation_details: { comment: null, feedback: null, reason: null },
    collection_method: 'charge_automatically',
    created: now,
    currency: input.price.currency,
    current_period_end: end,
    current_period_start: now,
    customer: input.customer,
    default_payment_method: input.paymentMethod,
    ended_at: null,
    items: {
      object: 'list',
      data: [{
        id: newId('si'),
        object: 'subscription_item',
        created: now,
        current_period_end: end,
        current_period_start: now,
        metadata: {},
        price: structuredClone(input.price),
        quantity: input.quantity,
        subscription: id,
      }],
      has_more: false,
      url: `/v1/subscription_items?subscription=${id}`,
    },
    latest_invoice: null,
    livemode: false,
    metadata: input.metadata,
    start_date: now,
    status: 'active',
  };
  ctx.state.subscriptions.add(subscription);
  const invoice = createInvoice(ctx, subscription, 'subscription_create', [seatLine(subscription, { start: now, end })], {
    start: now,
    end,
  });
  emitEvent(ctx, 'customer.subscription.created', subscription);
  collectInvoice(ctx, invoice, true);
  return subscription;
}

export interface SubscriptionChange {
  items?: { id?: string; quantity?: number }[];
  proration_behavior?: 'create_prorations' | 'always_invoice' | 'none';
  /** `error_if_incomplete`: a failed charge for the change answers 402 and changes nothing. */
  payment_behavior?: 'allow_incomplete' | 'error_if_incomplete';
  cancel_at_period_end?: boolean;
  metadata?: Metadata | null;
}

/** Seat-count change (prorated), cancel at period end or its undo, and metadata. */
export function changeSubscription(ctx: FakeContext, subscription: Subscription, change: SubscriptionChange): void {
  if (subscription.status === 'canceled') {
    throw invalidState('A canceled subscription can only update its cancellation_details and metadata.');
  }
  const item = subscription.items.data[0];
  const itemChange = change.items?.[0];
  if (change.items && change.items.length > 1) {
    throw invalidParam('items', 'The local fake sells a single seat price; send one item.');
  }
  if (itemChange?.id && itemChange.id !== item.id) throw noSuch('subscription item', itemChange.id, 'items[0][id]');
  const now = ctx.clock.now();
  const oldQuantity = item.quantity;
  const newQuantity = itemChange?.quantity ?? oldQuantity;
  const behavior = change.proration_behavior ?? 'create_prorations';
  const prorations =
    newQuantity === oldQuantity || behavior === 'none' ? [] : quantityProrationLines(subscription, oldQuantity, newQuantity, now);
  const invoiceNow = behavior === 'always_invoice' && prorations.length > 0;
  if (invoiceNow && change.payment_behavior === 'error_if_incomplete') {
    const total = prorations.reduce((sum, line) => sum + line.amount, 0);
    const due = amountDueAfterCredit(ctx, subscription.customer, total);
    if (due > 0 && savedCardChargeFails(ctx, subscription.customer)) throw cardError('card_declined', 'Your card was declined.', 'generic_decline');
  }

  const before = structuredClone(subscription);
  item.quantity = newQuantity;
  if (change.cancel_at_period_end !== undefined) {
    const cancelling = change.cancel_at_period_end;
    subscription.cancel_at_period_end = cancelling;
    subscription.cancel_at = cancelling ? subscription.current_period_end : null;
    subscription.canceled_at = cancelling ? now : null;
    subscription.cancellation_details.reason = cancelling ? 'cancellation_requested' : null;
  }
  if (change.metadata !== undefined) applyMetadataChanges(subscription.metadata, change.metadata);
  const previous = previousAttributes(before, subscription);
  if (Object.keys(previous).length > 0) emitEvent(ctx, 'customer.subscription.updated', subscription, previous);

  if (prorations.length === 0) return;
  if (!invoiceNow) {
    const pending = ctx.state.pendingProrations.get(subscription.id) ?? [];
    ctx.state.pendingProrations.set(subscription.id, [...pending, ...prorations]);
    return;
  }
  const invoice = createInvoice(ctx, subscription, 'subscription_update', prorations, {
    start: now,
    end: subscription.current_period_end,
  });
  // The card was already charged above when the caller asked for error_if_incomplete.
  collectInvoice(ctx, invoice, change.payment_behavior === 'error_if_incomplete');
}

export interface SubscriptionPreview {
  items?: { id?: string; quantity?: number }[];
  proration_behavior?: 'create_prorations' | 'always_invoice' | 'none';
  proration_date?: number;
}

/**
 * invoices.createPreview for a subscription change, changing nothing: with `always_invoice`
 * the invoice the change would charge at once (its prorations), otherwise the next renewal's
 * (pending prorations, this change's and the next period at the new seat count).
 */
export function previewSubscriptionChange(ctx: FakeContext, subscription: Subscription, change: SubscriptionPreview): PreviewInvoice {
  if (subscription.status === 'canceled') throw invalidState('A canceled subscription has no upcoming invoice.');
  const item = subscription.items.data[0];
  const itemChange = change.items?.[0];
  if (change.items && change.items.length > 1) throw invalidParam('subscription_details[items]', 'The local fake sells a single seat price; send one item.');
  if (itemChange?.id && itemChange.id !== item.id) throw noSuch('subscription item', itemChange.id, 'subscription_details[items][0][id]');
  const at = change.proration_date ?? ctx.clock.now();
  const newQuantity = itemChange?.quantity ?? item.quantity;
  const behavior = change.proration_behavior ?? 'create_prorations';
  const prorations = newQuantity === item.quantity || behavior === 'none' ? [] : quantityProrationLines(subscription, item.quantity, newQuantity, at);
  const { current_period_end: end } = subscription;
  if (behavior === 'always_invoice') return previewInvoice(ctx, subscription, 'subscription_update', prorations, { start: at, end });
  const next = { ...subscription, items: { ...subscription.items, data: [{ ...item, quantity: newQuantity }] } };
  const nextEnd = addInterval(end, item.price.recurring.interval);
  const pending = ctx.state.pendingProrations.get(subscription.id) ?? [];
  return previewInvoice(ctx, subscription, 'subscription_cycle', [...pending, ...prorations, seatLine(next, { start: end, end: nextEnd })], { start: end, end: nextEnd });
}

/** Ends the subscription at `at` (now, or the end of the period for a scheduled cancellation). */
export function endSubscription(ctx: FakeContext, subscription: Subscription, at = ctx.clock.now()): void {
  if (subscription.status === 'canceled') return;
  subscription.status = 'canceled';
  subscription.ended_at = at;
  subscription.canceled_at ??= at;
  subscription.cancellation_details.reason = 'cancellation_requested';
  ctx.state.pendingProrations.delete(subscription.id);
  emitEvent(ctx, 'customer.subscription.deleted', subscription);
}

/** Starts the next period: new period dates, an invoice for it (with pending prorations), a charge. */
function renewOnce(ctx: FakeContext, subscription: Subscription): void {
  const before = structuredClone(subscription);
  const item = subscription.items.data[0];
  const start = subscription.current_period_end;
  const end = addInterval(start, item.price.recurring.interval);
  subscription.current_period_start = item.current_period_start = start;
  subscription.current_period_end = item.current_period_end = end;
  emitEvent(ctx, 'customer.subscription.updated', subscription, previousAttributes(before, subscription));
  const pending = ctx.state.pendingProrations.get(subscription.id) ?? [];
  ctx.state.pendingProrations.delete(subscription.id);
  const invoice = createInvoice(ctx, subscription, 'subscription_cycle', [...pending, seatLine(subscription, { start, end })], {
    start,
    end,
  });
  collectInvoice(ctx, invoice);
}

/** Brings every subscription up to the clock: renews periods that ended, ends scheduled cancellations. */
export function renewDueSubscriptions(ctx: FakeContext): string[] {
  const touched: string[] = [];
  for (const subscription of ctx.state.subscriptions.newestFirst().reverse()) {
    while (subscription.status !== 'canceled' && subscription.current_period_end <= ctx.clock.now()) {
      if (!touched.includes(subscription.id)) touched.push(subscription.id);
      if (subscription.cancel_at_period_end) endSubscription(ctx, subscription, subscription.current_period_end);
      else renewOnce(ctx, subscription);
    }
  }
  return touched;
}
