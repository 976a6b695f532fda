import type { Knex } from 'knex';
import type Stripe from 'stripe';
import { isUniqueViolation } from '../../db-errors';
import { badRequest } from '../../errors';
import type { Logger } from '../../logger';
import { callPayments, toAppError } from './payments-client';
import { lockOrganisation, subscriptionOf, type SubscriptionRow } from './seats';
import { applySubscription, organisationIdOf, refOf } from './subscription-sync';

type RefField = string | { id: string } | null | undefined;

/** The subscription an event is about, for the event types that change seats or status. */
export function subscriptionRefOf(event: Stripe.Event): string | null {
  const object = event.data.object as unknown as Record<string, unknown>;
  if (event.type.startsWith('customer.subscription.')) return String(object.id);
  if (event.type.startsWith('invoice.')) {
    const parent = object.parent as { subscription_details?: { subscription?: RefField } } | null | undefined;
    return refOf(parent?.subscription_details?.subscription) ?? refOf(object.subscription as RefField);
  }
  if (event.type === 'checkout.session.completed') return refOf(object.subscription as RefField);
  return null;
}

/**
 * Applies signed webhook events. Each event id is stored once (primary key) in the same
 * transaction that applies it, so duplicates and replays change nothing. Events are not
 * trusted for state: the subscription is re-read from the service while the organisation
 * is locked, so events arriving late or out of order still leave the current state.
 */
export class WebhookService {
  constructor(
    private readonly db: Knex,
    private readonly payments: Stripe,
    private readonly secret: string,
    private readonly logger: Logger,
  ) {}

  verify(rawBody: Buffer, signature: string | undefined): Stripe.Event {
    if (!signature) throw badRequest('The webhook has no signature header.');
    try {
      return this.payments.webhooks.constructEvent(rawBody, signature, this.secret);
    } catch {
      throw badRequest('The webhook signature does not match or is too old.');
    }
  }

  /** True when the event was applied now, false when it had been applied before. */
  async receive(event: Stripe.Event): Promise<boolean> {
    if (await this.db('payment_events').where({ id: event.id }).first('id')) return false;
    const ref = subscriptionRefOf(event);
    // Read once to learn the organisation; read again under its lock for the state to keep.
    const first = ref ? await this.retrieve(ref) : null;
    const organisationId = first ? await this.knownOrganisation(organisationIdOf(first)) : null;
    let second: Stripe.Subscription | null = null;
    try {
      await this.db.transaction(async (trx) => {
        // Lock first: inserting the event (its foreign key) would otherwise take a shared lock on the
        // organisation row and then need to upgrade it, deadlocking against a seat change waiting there.
        if (ref && organisationId) await lockOrganisation(trx, organisationId);
        await trx('payment_events').insert({ id: event.id, type: event.type, organisation_id: organisationId });
        if (!ref || !organisationId) return;
        const current = await this.retrieve(ref);
        if (!current) return;
        if (isSecondSubscription(await subscriptionOf(trx, organisationId), current)) {
          second = current;
          return;
        }
        await applySubscription(trx, organisationId, current);
        if (current.status === 'active') await trx('pending_checkouts').where({ organisation_id: organisationId }).delete();
      });
    } catch (error) {
      if (isUniqueViolation(error)) return false;
      throw error;
    }
    if (second) await this.cancelAndRefund(organisationId!, second);
    return true;
  }

  /**
   * A second paid subscription for an organisation that already has an active one (two
   * checkouts paid despite everything): it is ended at the service at once and what it charged
   * is refunded, and the log says so. Our table keeps the first.
   */
  private async cancelAndRefund(organisationId: number, subscription: Stripe.Subscription): Promise<void> {
    await callPayments(() => this.payments.subscriptions.cancel(subscription.id));
    const invoices = await callPayments(() => this.payments.invoices.list({ subscription: subscription.id, status: 'paid', limit: 100 }));
    let refunded = 0;
    for (const invoice of invoices.data) {
      const paid = await callPayments(() => this.payments.invoicePayments.list({ invoice: invoice.id! }));
      for (const payment of paid.data) {
        const intent = refOf(payment.payment.payment_intent);
        if (!intent) continue;
        const refund = await callPayments(() => this.payments.refunds.create({ payment_intent: intent, reason: 'duplicate' }));
        refunded += refund.amount;
      }
    }
    this.logger.warn({ organisationId, subscription: subscription.id, refunded }, 'second subscription cancelled and refunded');
  }

  private async knownOrganisation(id: number | null): Promise<number | null> {
    if (id === null) return null;
    return (await this.db('organisations').where({ id }).first('id')) ? id : null;
  }

  /** The subscription as the service sees it now; null when the service does not know it (kept, not retried). */
  private async retrieve(ref: string): Promise<Stripe.Subscription | null> {
    try {
      return await this.payments.subscriptions.retrieve(ref);
    } catch (error) {
      if ((error as { code?: string }).code === 'resource_missing') return null;
      throw toAppError(error);
    }
  }
}

/** The subscription arriving is active and another one of the organisation is active in our table. */
function isSecondSubscription(row: SubscriptionRow | undefined, arriving: Stripe.Subscription): boolean {
  return row?.status === 'active' && row.subscription_ref !== arriving.id && (arriving.status === 'active' || arriving.status === 'trialing');
}
