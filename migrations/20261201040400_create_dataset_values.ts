import type { Knex } from 'knex';

/**
 * One row per value. `t` is the station's local time as written in the file (the dataset's
 * time zone says which); a missing value is a missing row, so gaps stay gaps.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('dataset_values')) return;
  await knex.schema.createTable('dataset_values', (t) => {
    t.integer('dataset_id').unsigned().notNullable().references('datasets.id').onDelete('CASCADE');
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.datetime('t').notNullable();
    t.double('value').notNullable();
    t.primary(['dataset_id', 't']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('dataset_values');
}
