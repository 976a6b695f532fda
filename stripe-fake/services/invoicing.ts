import type { FakeContext } from '../context';
import { newId } from '../ids';
import type { BillingReason, Invoice, InvoiceLine, Subscription } from '../types';
import { emitEvent, previousAttributes } from './events';

export type LineDraft = Omit<InvoiceLine, 'id' | 'invoice'>;

/** A subscription line for `quantity` seats over a period, at the item's price. */
export function seatLine(subscription: Subscription, period: { start: number; end: number }): LineDraft {
  const item = subscription.items.data[0];
  const { price } = item;
  return {
    object: 'line_item',
    amount: price.unit_amount * item.quantity,
    currency: price.currency,
    description: `${item.quantity} × seat (at ${formatMoney(price.unit_amount, price.currency)} / ${price.recurring.interval})`,
    livemode: false,
    metadata: {},
    period,
    pricing: priceDetails(subscription),
    proration: false,
    quantity: item.quantity,
    subscription: subscription.id,
  };
}

export function priceDetails(subscription: Subscription): InvoiceLine['pricing'] {
  const { price } = subscription.items.data[0];
  return {
    price_details: { price: price.id, product: price.product },
    type: 'price_details',
    unit_amount_decimal: price.unit_amount_decimal,
  };
}

export function formatMoney(amount: number, currency: string): string {
  return `${(amount / 100).toFixed(2)} ${currency.toUpperCase()}`;
}

/**
 * Creates and finalizes the invoice for a subscription. The customer's credit balance
 * (negative `balance`, left by downgrades) is used first, as the service does.
 */
export function createInvoice(
  ctx: FakeContext,
  subscription: Subscription,
  reason: BillingReason,
  drafts: LineDraft[],
  period: { start: number; end: number },
): Invoice {
  const customer = ctx.state.customers.get(subscription.customer)!;
  const id = newId('in');
  const invoice = invoiceOf(ctx, subscription, reason, drafts, period, id, `${customer.invoice_prefix}-${String(customer.next_invoice_sequence).padStart(4, '0')}`);
  customer.balance = invoice.ending_balance;
  customer.next_invoice_sequence += 1;
  subscription.latest_invoice = id;
  return ctx.state.invoices.add(invoice);
}

/** An invoice preview: a draft with no number and no hosted pages, as the service answers createPreview. */
export type PreviewInvoice = Omit<Invoice, 'number' | 'hosted_invoice_url' | 'invoice_pdf' | 'status' | 'status_transitions'> & {
  number: null;
  hosted_invoice_url: null;
  invoice_pdf: null;
  status: 'draft';
  status_transitions: { finalized_at: null; paid_at: null };
};

/** The invoice `drafts` would make, changing nothing and stored nowhere (invoices.createPreview). */
export function previewInvoice(
  ctx: FakeContext,
  subscription: Subscription,
  reason: BillingReason,
  drafts: LineDraft[],
  period: { start: number; end: number },
): PreviewInvoice {
  const { number: _number, hosted_invoice_url: _page, invoice_pdf: _pdf, status: _status, status_transitions: _transitions, ...invoice } =
    invoiceOf(ctx, subscription, reason, drafts, period, `upcoming_${subscription.id}`, '');
  return { ...invoice, number: null, hosted_invoice_url: null, invoice_pdf: null, status: 'draft', status_transitions: { finalized_at: null, paid_at: null } };
}

function invoiceOf(
  ctx: FakeContext,
  subscription: Subscription,
  reason: BillingReason,
  drafts: LineDraft[],
  period: { start: number; end: number },
  id: string,
  number: string,
): Invoice {
  const customer = ctx.state.customers.get(subscription.customer)!;
  const total = drafts.reduce((sum, line) => sum + line.amount, 0);
  const startingBalance = customer.balance;
  const amountDue = amountDueAfterCredit(ctx, customer.id, total);
  const now = ctx.clock.now();
  return {
    id,
    object: 'invoice',
    amount_due: amountDue,
    amount_paid: 0,
    amount_remaining: amountDue,
    attempt_count: 0,
    attempted: false,
    billing_reason: reason,
    collection_method: 'charge_automatically',
    created: now,
    currency: subscription.currency,
    customer: customer.id,
    customer_email: customer.email,
    customer_name: customer.name,
    ending_balance: Math.min(0, total + startingBalance),
    hosted_invoice_url: `${ctx.publicUrl}/hosted/invoices/${id}`,
    invoice_pdf: `${ctx.publicUrl}/hosted/invoices/${id}/pdf`,
    lines: {
      object: 'list',
      data: drafts.map((draft) => ({ ...draft, id: newId('il'), invoice: id })),
      has_more: false,
      url: `/v1/invoices/${id}/lines`,
    },
    livemode: false,
    metadata: {},
    number,
    parent: {
      quote_details: null,
      subscription_details: { metadata: { ...subscription.metadata }, subscription: subscription.id },
      type: 'subscription_details',
    },
    period_end: period.end,
    period_start: period.start,
    starting_balance: startingBalance,
    status: 'open',
    status_transitions: { finalized_at: now, paid_at: null },
    subscription: subscription.id,
    subtotal: total,
    total,
  };
}

/** Whether charging this customer's saved card fails now; uses up a fail-next flag. */
export function savedCardChargeFails(ctx: FakeContext, customerId: string): boolean {
  for (const key of [customerId, '*']) {
    if (ctx.state.failNextCharge.delete(key)) return true;
  }
  return !ctx.state.savedCards.has(customerId);
}

/** What the customer would owe for lines totalling `total`, after their credit balance. */
export function amountDueAfterCredit(ctx: FakeContext, customerId: string, total: number): number {
  return Math.max(0, total + ctx.state.customers.find(customerId).balance);
}

/**
 * Charges the invoice to the customer's saved card and announces the outcome:
 * `invoice.paid`, or `invoice.payment_failed` with the subscription going `past_due`.
 * `alreadyCharged`: the card was charged a moment ago (at checkout, or checking an error_if_incomplete change).
 */
export function collectInvoice(ctx: FakeContext, invoice: Invoice, alreadyCharged = false): Invoice {
  const subscription = ctx.state.subscriptions.get(invoice.subscription)!;
  const before = structuredClone(subscription);
  const needsCharge = invoice.amount_due > 0;
  const fails = needsCharge && !alreadyCharged && savedCardChargeFails(ctx, invoice.customer);
  if (needsCharge) {
    invoice.attempted = true;
    invoice.attempt_count += 1;
  }
  if (fails) {
    emitEvent(ctx, 'invoice.payment_failed', invoice);
    if (subscription.status === 'active') subscription.status = 'past_due';
  } else {
    invoice.status = 'paid';
    invoice.amount_paid = invoice.amount_due;
    invoice.amount_remaining = 0;
    invoice.status_transitions.paid_at = ctx.clock.now();
    if (invoice.amount_paid > 0) recordPayment(ctx, invoice);
    if (subscription.status === 'past_due') subscription.status = 'active';
    emitEvent(ctx, 'invoice.paid', invoice);
  }
  const changed = previousAttributes(before, subscription);
  if (Object.keys(changed).length > 0) {
    emitEvent(ctx, 'customer.subscription.updated', subscription, changed);
  }
  return invoice;
}

/** The payment a paid invoice took, as `invoicePayments.list({ invoice })` shows it (what a refund names). */
function recordPayment(ctx: FakeContext, invoice: Invoice): void {
  ctx.state.invoicePayments.add({
    id: newId('inpay'),
    object: 'invoice_payment',
    amount_paid: invoice.amount_paid,
    amount_requested: invoice.amount_paid,
    created: ctx.clock.now(),
    currency: invoice.currency,
    invoice: invoice.id,
    is_default: true,
    livemode: false,
    payment: { type: 'payment_intent', payment_intent: newId('pi') },
    status: 'paid',
  });
}
