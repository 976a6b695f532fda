import type { Knex } from 'knex';

/** Webhook events already applied; the primary key makes a duplicate delivery a no-op. */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('payment_events')) return;
  await knex.schema.createTable('payment_events', (t) => {
    t.string('id', 64).primary();
    t.string('type', 80).notNullable();
    t.integer('organisation_id').unsigned().nullable().references('organisations.id').onDelete('SET NULL');
    t.timestamp('received_at').notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('payment_events');
}
