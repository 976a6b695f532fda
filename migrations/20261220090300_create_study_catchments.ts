import type { Knex } from 'knex';

/** The catchments of a study, in the order they were added. */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('study_catchments')) return;
  await knex.schema.createTable('study_catchments', (t) => {
    t.increments('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.integer('study_id').unsigned().notNullable().references('studies.id').onDelete('CASCADE');
    t.integer('catchment_id').unsigned().notNullable().references('catchments.id').onDelete('CASCADE');
    t.unique(['study_id', 'catchment_id']);
    t.index(['organisation_id', 'study_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('study_catchments');
}
