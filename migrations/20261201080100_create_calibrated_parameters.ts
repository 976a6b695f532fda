import type { Knex } from 'knex';

/**
 * Calibrated parameters of a catchment, one row per save; the newest row is the set new scenarios
 * start from. Each row keeps who saved it, when, over which period and the scores at that time.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('calibrated_parameters')) return;
  await knex.schema.createTable('calibrated_parameters', (t) => {
    t.increments('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.integer('catchment_id').unsigned().notNullable().references('catchments.id').onDelete('CASCADE');
    t.json('parameters').notNullable();
    t.double('precipitation_factor').notNullable();
    t.date('period_from').notNullable();
    t.date('period_to').notNullable();
    t.json('scores').notNullable();
    t.string('note', 500).notNullable().defaultTo('');
    t.integer('saved_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.string('saved_by_name', 120).notNullable();
    t.timestamp('saved_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['organisation_id', 'catchment_id', 'saved_at'], 'calibrated_parameters_catchment_saved_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('calibrated_parameters');
}
