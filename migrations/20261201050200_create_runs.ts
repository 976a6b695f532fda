import type { Knex } from 'knex';

/**
 * A run: one job that simulates a scenario (and, for a variant, its baseline, the factor-separation
 * combinations and ensemble members). Inputs are copied in so a run can always be reproduced.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('runs')) return;
  await knex.schema.createTable('runs', (t) => {
    t.increments('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.integer('catchment_id').unsigned().notNullable().references('catchments.id').onDelete('CASCADE');
    t.integer('scenario_id').unsigned().notNullable().references('scenarios.id').onDelete('CASCADE');
    t.string('scenario_name', 120).notNullable();
    t.boolean('is_baseline').notNullable();
    t.json('changes').notNullable();
    t.json('baseline_changes').nullable();
    t.boolean('attribution').notNullable().defaultTo(false);
    t.smallint('ensemble_size').unsigned().notNullable().defaultTo(0);
    t.integer('ensemble_seed').unsigned().notNullable().defaultTo(1);
    t.enum('status', ['queued', 'running', 'done', 'failed', 'cancelled']).notNullable().defaultTo('queued');
    t.double('progress').notNullable().defaultTo(0);
    t.integer('simulation_count').unsigned().notNullable().defaultTo(0);
    t.text('error_message').nullable();
    t.string('engine_version', 32).notNullable();
    t.string('input_hash', 64).notNullable();
    t.date('period_from').nullable();
    t.date('period_to').nullable();
    t.integer('created_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('queued_at').notNullable().defaultTo(knex.fn.now());
    t.timestamp('started_at').nullable();
    t.timestamp('finished_at').nullable();
    t.index(['organisation_id', 'catchment_id', 'queued_at']);
    t.index(['organisation_id', 'input_hash', 'status']);
    t.index(['status']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('runs');
}
