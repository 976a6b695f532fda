/**
 * The resource shapes the fake returns: the fields our server reads, named and typed
 * as in the service's API (see the `stripe` SDK's .d.ts files), not every field it has.
 */
export type Metadata = Record<string, string>;
export type Interval = 'month' | 'year';

export interface ListObject<T> {
  object: 'list';
  data: T[];
  has_more: boolean;
  url: string;
}

export interface Customer {
  id: string;
  object: 'customer';
  balance: number;
  created: number;
  currency: string | null;
  description: string | null;
  email: string | null;
  invoice_prefix: string;
  invoice_settings: { default_payment_method: string | null };
  livemode: false;
  metadata: Metadata;
  name: string | null;
  next_invoice_sequence: number;
  phone: string | null;
}

export interface Product {
  id: string;
  object: 'product';
  active: boolean;
  created: number;
  default_price: string | null;
  description: string | null;
  livemode: false;
  metadata: Metadata;
  name: string;
  type: 'service';
  unit_label: string | null;
  updated: number;
}

export interface Price {
  id: string;
  object: 'price';
  active: boolean;
  billing_scheme: 'per_unit';
  created: number;
  currency: string;
  livemode: false;
  lookup_key: string | null;
  metadata: Metadata;
  nickname: string | null;
  product: string;
  recurring: { interval: Interval; interval_count: 1; usage_type: 'licensed'; meter: null };
  tax_behavior: 'unspecified';
  type: 'recurring';
  unit_amount: number;
  unit_amount_decimal: string;
}

export interface CheckoutSession {
  id: string;
  object: 'checkout.session';
  amount_subtotal: number;
  amount_total: number;
  cancel_url: string | null;
  client_reference_id: string | null;
  created: number;
  currency: string;
  customer: string | null;
  customer_details: { email: string | null; name: string | null } | null;
  customer_email: string | null;
  expires_at: number;
  invoice: string | null;
  line_items?: ListObject<unknown>;
  livemode: false;
  metadata: Metadata;
  mode: 'subscription';
  payment_method_types: string[];
  payment_status: 'unpaid' | 'paid';
  status: 'open' | 'complete' | 'expired';
  subscription: string | null;
  success_url: string;
  url: string | null;
}

/** What the session sells; kept beside it because `line_items` is not returned by default. */
export interface SessionOrder {
  price: string;
  quantity: number;
  subscriptionMetadata: Metadata;
}

export interface SubscriptionItem {
  id: string;
  object: 'subscription_item';
  created: number;
  current_period_end: number;
  current_period_start: number;
  metadata: Metadata;
  price: Price;
  quantity: number;
  subscription: string;
}

export type SubscriptionStatus = 'active' | 'past_due' | 'canceled';

export interface Subscription {
  id: string;
  object: 'subscription';
  billing_cycle_anchor: number;
  cancel_at: number | null;
  cancel_at_period_end: boolean;
  canceled_at: number | null;
  cancellation_details: { comment: null; feedback: null; reason: 'cancellation_requested' | null };
  collection_method: 'charge_automatically';
  created: number;
  currency: string;
  /** Also present on each item, where the newest API versions keep it. */
  current_period_end: number;
  current_period_start: number;
  customer: string;
  default_payment_method: string | null;
  ended_at: number | null;
  items: ListObject<SubscriptionItem>;
  latest_invoice: string | null;
  livemode: false;
  metadata: Metadata;
  start_date: number;
  status: SubscriptionStatus;
}

export interface InvoiceLine {
  id: string;
  object: 'line_item';
  amount: number;
  currency: string;
  description: string;
  invoice: string;
  livemode: false;
  metadata: Metadata;
  period: { start: number; end: number };
  pricing: { price_details: { price: string; product: string }; type: 'price_details'; unit_amount_decimal: string };
  proration: boolean;
  quantity: number;
  subscription: string | null;
}

export type InvoiceStatus = 'open' | 'paid';
export type BillingReason = 'subscription_create' | 'subscription_cycle' | 'subscription_update';

export interface Invoice {
  id: string;
  object: 'invoice';
  amount_due: number;
  amount_paid: number;
  amount_remaining: number;
  attempt_count: number;
  attempted: boolean;
  billing_reason: BillingReason;
  collection_method: 'charge_automatically';
  created: number;
  currency: string;
  customer: string;
  customer_email: string | null;
  customer_name: string | null;
  ending_balance: number;
  hosted_invoice_url: string;
  invoice_pdf: string;
  lines: ListObject<InvoiceLine>;
  livemode: false;
  metadata: Metadata;
  number: string;
  parent: {
    quote_details: null;
    subscription_details: { metadata: Metadata; subscription: string };
    type: 'subscription_details';
  };
  period_end: number;
  period_start: number;
  starting_balance: number;
  status: InvoiceStatus;
  status_transitions: { finalized_at: number; paid_at: number | null };
  /** Not in the newest API versions (see `parent`), kept for code written against older ones. */
  subscription: string;
  subtotal: number;
  total: number;
}

export type EventType =
  | 'checkout.session.completed'
  | 'customer.subscription.created'
  | 'customer.subscription.updated'
  | 'customer.subscription.deleted'
  | 'invoice.paid'
  | 'invoice.payment_failed';

export interface StripeEvent {
  id: string;
  object: 'event';
  api_version: string;
  created: number;
  data: { object: unknown; previous_attributes?: Record<string, unknown> };
  livemode: false;
  pending_webhooks: number;
  request: { id: string | null; idempotency_key: string | null };
  type: EventType;
}

/** How an invoice was paid (`invoicePayments.list({ invoice })`): the payment intent a refund names. */
export interface InvoicePayment {
  id: string;
  object: 'invoice_payment';
  amount_paid: number;
  amount_requested: number;
  created: number;
  currency: string;
  invoice: string;
  is_default: true;
  livemode: false;
  payment: { type: 'payment_intent'; payment_intent: string };
  status: 'paid';
}

export interface Refund {
  id: string;
  object: 'refund';
  amount: number;
  created: number;
  currency: string;
  metadata: Metadata;
  payment_intent: string;
  reason: 'duplicate' | 'fraudulent' | 'requested_by_customer' | null;
  status: 'succeeded';
}
