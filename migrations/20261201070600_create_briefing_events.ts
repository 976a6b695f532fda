import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('briefing_events')) return;
  await knex.schema.createTable('briefing_events', (t) => {
    t.bigIncrements('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.integer('briefing_id').unsigned().notNullable().references('briefings.id').onDelete('CASCADE');
    t.integer('version').unsigned().nullable();
    t.integer('user_id').unsigned().nullable().references('users.id').onDelete('SET NULL');
    // Kept with the event so the log still reads right after a user is removed.
    t.string('user_email', 254).notNullable();
    t.string('action', 32).notNullable();
    t.string('detail', 500).notNullable().defaultTo('');
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['briefing_id', 'created_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('briefing_events');
}
