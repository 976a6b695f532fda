import type { Knex } from 'knex';
import type Stripe from 'stripe';
import { subscriptionOf, type SubscriptionRow } from './seats';

/** The organisation a subscription was bought for, from the metadata our checkout sets. */
export function organisationIdOf(subscription: Stripe.Subscription): number | null {
  const id = Number(subscription.metadata?.organisation_id);
  return Number.isSafeInteger(id) && id > 0 ? id : null;
}

/** The service has more states than we act on: anything neither active nor over is treated as unpaid. */
function localStatus(status: Stripe.Subscription.Status): SubscriptionRow['status'] {
  if (status === 'active' || status === 'trialing') return 'active';
  if (status === 'canceled' || status === 'incomplete_expired') return 'canceled';
  return 'past_due';
}

/** The id of an expandable field, whether it came as an id or as the expanded object. */
export const refOf = (value: string | { id: string } | null | undefined): string | null =>
  value == null ? null : typeof value === 'string' ? value : value.id;

/**
 * Writes the service's current view of a subscription into our table, inside the
 * caller's transaction (which must hold lockOrganisation). An older subscription that
 * ends never overwrites a newer one that is still running.
 */
export async function applySubscription(trx: Knex.Transaction, organisationId: number, subscription: Stripe.Subscription): Promise<void> {
  const item = subscription.items.data[0];
  if (!item) return;
  const current = await subscriptionOf(trx, organisationId);
  const status = localStatus(subscription.status);
  if (current && current.subscription_ref !== subscription.id && current.status !== 'canceled' && status === 'canceled') return;
  const periodEnd = item.current_period_end ?? (subscription as unknown as { current_period_end?: number }).current_period_end;
  const row = {
    organisation_id: organisationId,
    customer_ref: refOf(subscription.customer) ?? '',
    subscription_ref: subscription.id,
    item_ref: item.id,
    price_lookup_key: item.price.lookup_key ?? null,
    status,
    seats: item.quantity ?? 0,
    current_period_end: periodEnd ? new Date(periodEnd * 1000) : null,
    cancel_at_period_end: subscription.cancel_at_period_end || (subscription.cancel_at !== null && status !== 'canceled'),
    updated_at: new Date(),
  };
  await trx('subscriptions').insert(row).onConflict('organisation_id').merge();
}
