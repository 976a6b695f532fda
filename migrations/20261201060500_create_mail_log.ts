import type { Knex } from 'knex';

/** Mails sent per address, kept to rate-limit them (no bodies are stored). */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('mail_log')) return;
  await knex.schema.createTable('mail_log', (t) => {
    t.increments('id').primary();
    t.string('recipient', 254).notNullable();
    t.string('kind', 40).notNullable();
    t.timestamp('sent_at').notNullable().defaultTo(knex.fn.now());
    t.index(['recipient', 'sent_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('mail_log');
}
