import type { Knex } from 'knex';
import { DEMO_ORGANISATION, DEMO_SUBSCRIPTION } from './data/demo-accounts';

/**
 * The demo consultancy's active seat plan. The references are placeholders: the local
 * payment fake starts empty, so `npm start` buys the same plan in it on start-up and the
 * webhook replaces these references (scripts/lib/paid-plan.ts). Safe to re-run.
 */
export async function seed(knex: Knex): Promise<void> {
  const organisation = await knex('organisations').where({ name: DEMO_ORGANISATION.name }).first('id');
  if (!organisation) throw new Error('Run 01_demo_organisation first: the demo organisation is missing.');
  await knex('subscriptions')
    .insert({
      organisation_id: organisation.id,
      customer_ref: 'cus_demo_placeholder',
      subscription_ref: 'sub_demo_placeholder',
      item_ref: 'si_demo_placeholder',
      price_lookup_key: 'seat_monthly',
      status: 'active',
      seats: DEMO_SUBSCRIPTION.seats,
      current_period_end: new Date(Date.now() + 30 * 86_400_000),
      cancel_at_period_end: false,
    })
    .onConflict('organisation_id')
    .merge();
}
