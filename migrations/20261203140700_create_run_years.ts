import type { Knex } from 'knex';

/**
 * Multi-decade (transient) runs, per member and scenario year: the glacier at the start of the
 * year, its balance, the runoff by source and the glacier runoff (for peak water), with the
 * glacier area per band as JSON.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('run_years')) return;
  await knex.schema.createTable('run_years', (t) => {
    t.bigIncrements('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.integer('member_id').unsigned().notNullable().references('run_members.id').onDelete('CASCADE');
    t.smallint('year').unsigned().notNullable();
    t.smallint('record_year').unsigned().notNullable();
    t.double('temperature_delta_c').notNullable();
    t.double('precipitation_factor').notNullable();
    t.double('glacier_area_km2').notNullable();
    t.double('glacier_volume_km3').notNullable();
    t.double('mass_balance_mm').notNullable();
    t.double('volume_change_m3').notNullable();
    t.double('snow_m3').notNullable();
    t.double('ice_m3').notNullable();
    t.double('debris_ice_m3').notNullable();
    t.double('rain_m3').notNullable();
    t.double('glacier_runoff_m3').notNullable();
    t.json('band_glacier_area_km2').notNullable();
    t.unique(['member_id', 'year']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('run_years');
}
