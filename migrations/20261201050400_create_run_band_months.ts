import type { Knex } from 'knex';

/** Per band × calendar month totals of one run member: melt by source (mm w.e. over the band), albedo and energy. */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('run_band_months')) return;
  await knex.schema.createTable('run_band_months', (t) => {
    t.bigIncrements('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.integer('member_id').unsigned().notNullable().references('run_members.id').onDelete('CASCADE');
    t.smallint('band_index').unsigned().notNullable();
    t.string('month', 7).notNullable();
    t.tinyint('days').unsigned().notNullable();
    t.double('snow_melt_mm').notNullable();
    t.double('ice_melt_mm').notNullable();
    t.double('debris_ice_melt_mm').notNullable();
    t.double('rain_mm').notNullable();
    t.double('snowfall_mm').notNullable();
    t.double('mean_albedo').nullable();
    t.double('absorbed_shortwave_wm2').notNullable();
    t.double('net_shortwave_wm2').notNullable();
    t.double('net_longwave_wm2').notNullable();
    t.double('sensible_heat_wm2').notNullable();
    t.unique(['member_id', 'band_index', 'month']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('run_band_months');
}
