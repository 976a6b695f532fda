import type { Knex } from 'knex';

/** Scenarios of a catchment: one baseline and any number of variants; changes are validated JSON (shared/schemas/scenarios.ts). */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('scenarios')) return;
  await knex.schema.createTable('scenarios', (t) => {
    t.increments('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.integer('catchment_id').unsigned().notNullable().references('catchments.id').onDelete('CASCADE');
    t.string('name', 120).notNullable();
    t.text('description').notNullable();
    t.boolean('is_baseline').notNullable().defaultTo(false);
    t.smallint('schema_version').unsigned().notNullable();
    t.json('changes').notNullable();
    t.integer('created_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('archived_at').nullable();
    t.timestamps(true, true);
    t.unique(['catchment_id', 'name']);
    t.index(['organisation_id', 'catchment_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('scenarios');
}
