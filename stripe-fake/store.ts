import { noSuch } from './errors';
import type {
  CheckoutSession, Customer, Invoice, InvoiceLine, InvoicePayment, Price, Product, Refund, SessionOrder, StripeEvent, Subscription,
} from './types';

/** Objects of one kind, kept in creation order. */
export class Collection<T extends { id: string }> {
  private readonly items = new Map<string, T>();

  constructor(readonly resourceName: string) {}

  add(item: T): T {
    this.items.set(item.id, item);
    return item;
  }

  get(id: string): T | undefined {
    return this.items.get(id);
  }

  /** The object, or the service's resource_missing error (404; 400 naming `param` for a body parameter). */
  find(id: string, param?: string): T {
    const item = this.items.get(id);
    if (!item) throw noSuch(this.resourceName, id, param);
    return item;
  }

  /** Newest first, as the service lists. */
  newestFirst(filter: (item: T) => boolean = () => true): T[] {
    return [...this.items.values()].filter(filter).reverse();
  }

  clear(): void {
    this.items.clear();
  }
}

/** A card the customer paid with at checkout, charged again for renewals and prorations. */
export interface SavedCard {
  paymentMethodId: string;
  brand: string;
  last4: string;
}

export interface StoredResponse {
  fingerprint: string;
  status: number;
  body: unknown;
}

export interface FakeStripeState {
  customers: Collection<Customer>;
  products: Collection<Product>;
  prices: Collection<Price>;
  sessions: Collection<CheckoutSession>;
  subscriptions: Collection<Subscription>;
  invoices: Collection<Invoice>;
  events: Collection<StripeEvent>;
  sessionOrders: Map<string, SessionOrder>;
  savedCards: Map<string, SavedCard>;
  /** Proration lines waiting for the subscription's next invoice (`create_prorations`). */
  pendingProrations: Map<string, Omit<InvoiceLine, 'id' | 'invoice'>[]>;
  /** Customers whose next charge fails; `*` fails the next charge of anyone. */
  failNextCharge: Set<string>;
  idempotency: Map<string, StoredResponse>;
  /** One payment per paid invoice that took money. */
  invoicePayments: Collection<InvoicePayment>;
  refunds: Collection<Refund>;
}

export function createState(): FakeStripeState {
  return {
    customers: new Collection('customer'),
    products: new Collection('product'),
    prices: new Collection('price'),
    sessions: new Collection('checkout.session'),
    subscriptions: new Collection('subscription'),
    invoices: new Collection('invoice'),
    events: new Collection('event'),
    sessionOrders: new Map(),
    savedCards: new Map(),
    pendingProrations: new Map(),
    failNextCharge: new Set(),
    invoicePayments: new Collection('invoice_payment'),
    refunds: new Collection('refund'),
    idempotency: new Map(),
  };
}

export function clearState(state: FakeStripeState): void {
  for (const value of Object.values(state)) value.clear();
}
