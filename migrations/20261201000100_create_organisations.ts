import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('organisations')) return;
  await knex.schema.createTable('organisations', (t) => {
    t.increments('id').primary();
    t.string('name', 120).notNullable();
    t.timestamps(true, true);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('organisations');
}
