import type { Knex } from 'knex';

/**
 * The run of each catchment × scenario template of a study: the one whose results the study
 * reads. A retry points the cell at its new run; a run reused from earlier work is linked as it is.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('study_runs')) return;
  await knex.schema.createTable('study_runs', (t) => {
    t.increments('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.integer('study_id').unsigned().notNullable().references('studies.id').onDelete('CASCADE');
    t.integer('study_scenario_id').unsigned().notNullable().references('study_scenarios.id').onDelete('CASCADE');
    t.integer('catchment_id').unsigned().notNullable().references('catchments.id').onDelete('CASCADE');
    t.integer('run_id').unsigned().nullable().references('runs.id').onDelete('SET NULL');
    // Why the cell has no run (its inputs could not be simulated), in the words shown to the user.
    t.text('error_message').nullable();
    t.unique(['study_id', 'study_scenario_id', 'catchment_id']);
    t.index(['organisation_id', 'study_id']);
    t.index(['run_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('study_runs');
}
