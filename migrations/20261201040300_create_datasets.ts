import type { Knex } from 'knex';

/** A station series or observation record of one variable, with its provenance. */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('datasets')) return;
  await knex.schema.createTable('datasets', (t) => {
    t.increments('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.integer('catchment_id').unsigned().notNullable().references('catchments.id').onDelete('CASCADE');
    t.string('variable', 32).notNullable();
    t.enum('kind', ['climate', 'observation']).notNullable();
    t.string('unit', 20).notNullable();
    t.string('original_unit', 20).notNullable();
    t.enum('time_step', ['hourly', 'daily']).notNullable();
    t.string('time_zone', 64).notNullable();
    t.string('source', 300).notNullable();
    t.string('accuracy', 200).notNullable().defaultTo('');
    t.string('file_name', 255).notNullable().defaultTo('');
    t.integer('uploaded_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.string('uploaded_by_name', 120).notNullable().defaultTo('');
    t.string('first_at', 16).nullable();
    t.string('last_at', 16).nullable();
    t.integer('value_count').unsigned().notNullable().defaultTo(0);
    t.timestamps(true, true);
    t.index(['organisation_id', 'catchment_id', 'variable']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('datasets');
}
