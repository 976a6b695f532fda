import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('briefing_comments')) return;
  await knex.schema.createTable('briefing_comments', (t) => {
    t.increments('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.integer('briefing_id').unsigned().notNullable().references('briefings.id').onDelete('CASCADE');
    // The version the writer was reading, so a question stays tied to the numbers it is about.
    t.integer('version').unsigned().nullable();
    t.integer('user_id').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.text('body').notNullable();
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.index(['briefing_id', 'created_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('briefing_comments');
}
