import type { Knex } from 'knex';

/**
 * Gives an organisation an active seat plan straight in the database, for tests of paid
 * features (starting runs) that do not exercise billing. Billing tests buy plans through
 * the payment fake instead (team-harness.ts).
 */
export async function grantActivePlan(db: Knex, organisationId: number, seats = 10): Promise<void> {
  await db('subscriptions')
    .insert({
      organisation_id: organisationId,
      customer_ref: `cus_test_${organisationId}`,
      subscription_ref: `sub_test_${organisationId}`,
      item_ref: `si_test_${organisationId}`,
      price_lookup_key: 'seat_monthly',
      status: 'active',
      seats,
      current_period_end: new Date(Date.now() + 30 * 86_400_000),
      cancel_at_period_end: false,
    })
    .onConflict('organisation_id')
    .merge();
}
