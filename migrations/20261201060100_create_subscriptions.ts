import type { Knex } from 'knex';

/** One row per organisation: its seat plan as last confirmed by the payment service. */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('subscriptions')) return;
  await knex.schema.createTable('subscriptions', (t) => {
    t.increments('id').primary();
    t.integer('organisation_id').unsigned().notNullable().unique().references('organisations.id').onDelete('CASCADE');
    t.string('customer_ref', 64).notNullable();
    t.string('subscription_ref', 64).notNullable().unique();
    t.string('item_ref', 64).notNullable();
    t.string('price_lookup_key', 64).nullable();
    t.enum('status', ['active', 'past_due', 'canceled']).notNullable();
    t.integer('seats').unsigned().notNullable();
    t.datetime('current_period_end').nullable();
    t.boolean('cancel_at_period_end').notNullable().defaultTo(false);
    t.timestamps(true, true);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('subscriptions');
}
