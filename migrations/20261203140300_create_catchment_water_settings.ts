import type { Knex } from 'knex';

/**
 * How a catchment's water side is simulated: the vertical gradients chosen from its stations,
 * snow redistribution, runoff routing and the initial glacier of multi-decade runs — one row per
 * catchment, the settings as versioned JSON (shared/schemas/water-settings.ts). No row: the
 * defaults (the engine's own lapse rate and gradient, nothing redistributed, no routing).
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('catchment_water_settings')) return;
  await knex.schema.createTable('catchment_water_settings', (t) => {
    t.increments('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.integer('catchment_id').unsigned().notNullable().unique().references('catchments.id').onDelete('CASCADE');
    t.json('settings').notNullable();
    t.integer('updated_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.timestamps(true, true);
    t.index(['organisation_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('catchment_water_settings');
}
