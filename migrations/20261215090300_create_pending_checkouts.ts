import type { Knex } from 'knex';

/**
 * The checkout an organisation has open at the payment service (one at most): asking again for
 * the same plan hands back the same page instead of opening a second one that could also be
 * paid. `idem_key` is sent as the service's idempotency key, so a retried create opens nothing new.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('pending_checkouts')) return;
  await knex.schema.createTable('pending_checkouts', (t) => {
    t.integer('organisation_id').unsigned().primary().references('organisations.id').onDelete('CASCADE');
    t.enum('billing_interval', ['monthly', 'yearly']).notNullable();
    t.integer('seats').unsigned().notNullable();
    t.string('idem_key', 64).notNullable();
    t.string('session_ref', 255).nullable();
    t.string('url', 2000).nullable();
    t.timestamp('expires_at').nullable();
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('pending_checkouts');
}
