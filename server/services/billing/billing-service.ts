import type { Knex } from 'knex';
import type Stripe from 'stripe';
import type { UserRow } from '../auth/auth-service';
import type { AppConfig } from '../../config';
import { conflict, notFound, paymentRequired } from '../../errors';
import {
  BILLING_INTERVALS,
  type BillingInterval,
  type BillingSummary,
  type CheckoutRequest,
  type Invoice,
  type Plan,
  type SeatChangePreview,
  type Subscription,
} from '../../../shared/schemas/billing';
import type { TenantScope } from '../tenant-scope';
import { callPayments } from './payments-client';
import { isActive, lockOrganisation, NO_SUBSCRIPTION, seatsInUse, seatUsage, subscriptionOf, type SubscriptionRow } from './seats';
import { openCheckoutOnce } from './pending-checkout';
import { applySubscription } from './subscription-sync';

/** A proration line, as the payment service marks it (its parent's proration flag in newer API versions). */
const isProration = (line: Stripe.InvoiceLineItem) =>
  (line as { proration?: boolean }).proration === true || line.parent?.subscription_item_details?.proration === true;

/** Seat plans bought, resized and cancelled through the payment service; our table follows its answers and webhooks. */
export class BillingService {
  constructor(
    private readonly db: Knex,
    private readonly payments: Stripe,
    private readonly config: AppConfig,
  ) {}

  async plans(): Promise<Plan[]> {
    const { monthly, yearly } = this.config.billing.prices;
    const prices = await callPayments(() => this.payments.prices.list({ lookup_keys: [monthly, yearly], active: true }));
    const plans = prices.data.flatMap((price) => {
      const interval = this.intervalOf(price.lookup_key);
      return interval ? [{ interval, unitAmount: price.unit_amount ?? 0, currency: price.currency }] : [];
    });
    return plans.sort((a, b) => BILLING_INTERVALS.indexOf(a.interval) - BILLING_INTERVALS.indexOf(b.interval));
  }

  async summary(scope: TenantScope): Promise<BillingSummary> {
    const row = await subscriptionOf(this.db, scope.organisationId);
    return { subscription: row ? this.toSubscription(row) : null, seats: await seatUsage(this.db, scope.organisationId) };
  }

  /** The guard for paid features (starting runs, adding paid members): 402 without an active plan. */
  async assertCanUsePaidFeatures(scope: TenantScope): Promise<void> {
    if (!isActive(await subscriptionOf(this.db, scope.organisationId))) throw paymentRequired(NO_SUBSCRIPTION);
  }

  /**
   * A checkout session on the payment service's page; the subscription arrives by webhook once
   * paid. Under the organisation's lock, with at most one checkout open (see pending-checkout.ts):
   * asking twice hands back the same page.
   */
  async startCheckout(scope: TenantScope, admin: UserRow, request: CheckoutRequest): Promise<string> {
    return this.db.transaction(async (trx) => {
      await lockOrganisation(trx, scope.organisationId);
      const row = await subscriptionOf(trx, scope.organisationId);
      if (row && row.status !== 'canceled') {
        throw conflict('Your organisation already has a seat plan; change its seat count instead of buying another.');
      }
      const inUse = await seatsInUse(trx, scope.organisationId);
      if (request.seats < inUse) {
        throw conflict(`${inUse} members take a seat; buy at least ${inUse} seats.`, 'seats');
      }
      const payer = { customer: row?.customer_ref, email: admin.email };
      return openCheckoutOnce(trx, this.payments, scope.organisationId, request, (key) => this.openCheckout(scope.organisationId, payer, request, key));
    });
  }

  /** A checkout session for this organisation; the subscription it creates carries the organisation's id. */
  async openCheckout(
    organisationId: number,
    payer: { customer?: string; email: string },
    request: CheckoutRequest,
    idempotencyKey?: string,
  ): Promise<Stripe.Checkout.Session> {
    const price = await this.priceFor(request.interval);
    const base = this.config.publicUrl;
    const organisation = String(organisationId);
    return callPayments(() =>
      this.payments.checkout.sessions.create({
        mode: 'subscription',
        ...(payer.customer ? { customer: payer.customer } : { customer_email: payer.email }),
        line_items: [{ price: price.id, quantity: request.seats }],
        client_reference_id: organisation,
        metadata: { organisation_id: organisation },
        subscription_data: { metadata: { organisation_id: organisation } },
        success_url: `${base}/billing?checkout=done`,
        cancel_url: `${base}/billing?checkout=cancelled`,
      }, idempotencyKey ? { idempotencyKey } : undefined),
    );
  }

  /**
   * Changes the paid seats. More seats are charged at once (a failed charge changes
   * nothing); fewer are refused below the seats in use. The organisation stays locked
   * from the count to the write, so an invitation cannot slip in between.
   */
  async resize(scope: TenantScope, seats: number): Promise<Subscription> {
    return this.db.transaction(async (trx) => {
      const row = await this.lockedActive(trx, scope.organisationId);
      const inUse = await seatsInUse(trx, scope.organisationId);
      if (seats < inUse) {
        throw conflict(`${inUse} members take a seat, so the plan cannot go below ${inUse} seats. Remove members or change them to clients first.`, 'seats');
      }
      const growing = seats > row.seats;
      const updated = await callPayments(() =>
        this.payments.subscriptions.update(row.subscription_ref, {
          items: [{ id: row.item_ref, quantity: seats }],
          proration_behavior: growing ? 'always_invoice' : 'create_prorations',
          ...(growing ? { payment_behavior: 'error_if_incomplete' as const } : {}),
        }),
      );
      await applySubscription(trx, scope.organisationId, updated);
      return this.toSubscription((await subscriptionOf(trx, scope.organisationId))!);
    });
  }

  /**
   * What changing to `seats` would charge or credit, from the payment service's invoice preview
   * with the same proration the change itself uses (see resize); nothing changes.
   */
  async previewResize(scope: TenantScope, seats: number): Promise<SeatChangePreview> {
    const row = await subscriptionOf(this.db, scope.organisationId);
    if (!row) throw notFound('Seat plan');
    if (!isActive(row)) throw paymentRequired('The seat plan is not active; buy a new plan instead.');
    const growing = seats > row.seats;
    const preview = await callPayments(() =>
      this.payments.invoices.createPreview({
        subscription: row.subscription_ref,
        subscription_details: { items: [{ id: row.item_ref, quantity: seats }], proration_behavior: growing ? 'always_invoice' : 'create_prorations' },
      }),
    );
    const prorationAmount = preview.lines.data.filter((line) => isProration(line)).reduce((sum, line) => sum + line.amount, 0);
    return {
      seats, currentSeats: row.seats, chargedNow: growing, prorationAmount, amountDue: preview.amount_due, currency: preview.currency,
      nextInvoiceAt: this.toSubscription(row).currentPeriodEnd,
    };
  }

  /** Cancels at the end of the paid period, or undoes that while the period runs. */
  async setCancelAtPeriodEnd(scope: TenantScope, cancel: boolean): Promise<Subscription> {
    return this.db.transaction(async (trx) => {
      const row = await this.lockedActive(trx, scope.organisationId);
      const updated = await callPayments(() =>
        this.payments.subscriptions.update(row.subscription_ref, { cancel_at_period_end: cancel }),
      );
      await applySubscription(trx, scope.organisationId, updated);
      return this.toSubscription((await subscriptionOf(trx, scope.organisationId))!);
    });
  }

  async invoices(scope: TenantScope): Promise<Invoice[]> {
    const row = await subscriptionOf(this.db, scope.organisationId);
    if (!row) return [];
    const list = await callPayments(() => this.payments.invoices.list({ customer: row.customer_ref, limit: 24 }));
    return list.data.map((invoice) => ({
      id: invoice.id ?? '',
      number: invoice.number ?? null,
      createdAt: new Date(invoice.created * 1000).toISOString(),
      status: invoice.status ?? 'draft',
      reason: invoice.billing_reason ?? null,
      amountDue: invoice.amount_due,
      amountPaid: invoice.amount_paid,
      currency: invoice.currency,
      pageUrl: invoice.hosted_invoice_url ?? null,
      pdfUrl: invoice.invoice_pdf ?? null,
    }));
  }

  private async lockedActive(trx: Knex.Transaction, organisationId: number): Promise<SubscriptionRow> {
    await lockOrganisation(trx, organisationId);
    const row = await subscriptionOf(trx, organisationId);
    if (!row) throw notFound('Seat plan');
    if (!isActive(row)) throw paymentRequired('The seat plan is not active; buy a new plan instead.');
    return row;
  }

  private async priceFor(interval: BillingInterval): Promise<Stripe.Price> {
    const key = this.config.billing.prices[interval];
    const prices = await callPayments(() => this.payments.prices.list({ lookup_keys: [key], active: true }));
    const price = prices.data[0];
    if (!price) throw notFound(`The ${interval} seat price (${key})`);
    return price;
  }

  private intervalOf(lookupKey: string | null): BillingInterval | null {
    const { monthly, yearly } = this.config.billing.prices;
    return lookupKey === monthly ? 'monthly' : lookupKey === yearly ? 'yearly' : null;
  }

  private toSubscription(row: SubscriptionRow): Subscription {
    return {
      status: row.status,
      seats: row.seats,
      interval: this.intervalOf(row.price_lookup_key),
      currentPeriodEnd: row.current_period_end ? new Date(row.current_period_end).toISOString() : null,
      cancelAtPeriodEnd: Boolean(row.cancel_at_period_end),
    };
  }
}
