import type { Knex } from 'knex';

/**
 * Precipitation closed by the catchment's water balance, one row per save (the newest is the one
 * scenarios use when they choose "the water-balance precipitation"): the period, the factor and
 * profile found with their uncertainties and the balance terms, as JSON.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('water_balance_closures')) return;
  await knex.schema.createTable('water_balance_closures', (t) => {
    t.increments('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.integer('catchment_id').unsigned().notNullable().references('catchments.id').onDelete('CASCADE');
    t.date('period_from').notNullable();
    t.date('period_to').notNullable();
    t.json('closure').notNullable();
    t.string('note', 500).notNullable().defaultTo('');
    t.integer('saved_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.string('saved_by_name', 120).notNullable();
    t.timestamp('saved_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['organisation_id', 'catchment_id', 'saved_at'], 'water_balance_closures_catchment_saved_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('water_balance_closures');
}
