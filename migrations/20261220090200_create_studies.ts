import type { Knex } from 'knex';

/**
 * A regional study: catchments of one organisation, scenario templates applied to each (with
 * values per catchment where they differ) and the run options every run of the study shares.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('studies')) return;
  await knex.schema.createTable('studies', (t) => {
    t.increments('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.string('name', 120).notNullable();
    t.text('description').notNullable();
    // { attribution, ensembleSize, ensembleSeed, start, period } (shared/schemas/studies.ts)
    t.json('options').notNullable();
    t.integer('created_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.timestamp('started_at', { precision: 3 }).nullable();
    t.unique(['organisation_id', 'name']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('studies');
}
