import type { Knex } from 'knex';

/**
 * A study's scenario templates: changes applied to every catchment of the study, and per
 * catchment the changes that differ there (`study_scenario_values`, merged over the template).
 */
export async function up(knex: Knex): Promise<void> {
  if (!(await knex.schema.hasTable('study_scenarios'))) {
    await knex.schema.createTable('study_scenarios', (t) => {
      t.increments('id').primary();
      t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
      t.integer('study_id').unsigned().notNullable().references('studies.id').onDelete('CASCADE');
      t.string('name', 120).notNullable();
      t.json('changes').notNullable();
      t.unique(['study_id', 'name']);
      t.index(['organisation_id', 'study_id']);
    });
  }
  if (!(await knex.schema.hasTable('study_scenario_values'))) {
    await knex.schema.createTable('study_scenario_values', (t) => {
      t.increments('id').primary();
      t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
      t.integer('study_scenario_id').unsigned().notNullable().references('study_scenarios.id').onDelete('CASCADE');
      t.integer('catchment_id').unsigned().notNullable().references('catchments.id').onDelete('CASCADE');
      t.json('changes').notNullable();
      t.unique(['study_scenario_id', 'catchment_id']);
      t.index(['organisation_id', 'study_scenario_id']);
    });
  }
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('study_scenario_values');
  await knex.schema.dropTableIfExists('study_scenarios');
}
