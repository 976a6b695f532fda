import type { Knex } from 'knex';

/**
 * Observations reduced from remote sensing, per elevation range of the band table they were
 * reduced for: snow-covered fraction per map date (with the valid and cloud fractions), and
 * glacier elevation change with the geodetic balance and their uncertainties. Each row belongs
 * to the upload it came from and goes with it.
 */
export async function up(knex: Knex): Promise<void> {
  if (!(await knex.schema.hasTable('snow_cover_observations'))) {
    await knex.schema.createTable('snow_cover_observations', (t) => {
      t.increments('id').primary();
      t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
      t.integer('catchment_id').unsigned().notNullable().references('catchments.id').onDelete('CASCADE');
      t.integer('upload_id').unsigned().notNullable().references('geodata_uploads.id').onDelete('CASCADE');
      t.date('observed_on').notNullable();
      t.double('lower_m').notNullable();
      t.double('upper_m').notNullable();
      t.double('snow_covered_fraction').nullable();
      t.double('valid_fraction').notNullable();
      t.double('cloud_fraction').notNullable();
      t.index(['organisation_id', 'catchment_id', 'observed_on'], 'snow_cover_observations_catchment_date');
    });
  }
  if (!(await knex.schema.hasTable('elevation_change_observations'))) {
    await knex.schema.createTable('elevation_change_observations', (t) => {
      t.increments('id').primary();
      t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
      t.integer('catchment_id').unsigned().notNullable().references('catchments.id').onDelete('CASCADE');
      t.integer('upload_id').unsigned().notNullable().references('geodata_uploads.id').onDelete('CASCADE');
      t.date('from_date').notNullable();
      t.date('to_date').notNullable();
      t.double('lower_m').notNullable();
      t.double('upper_m').notNullable();
      t.double('glacier_area_km2').notNullable();
      t.double('covered_fraction').notNullable();
      t.double('dhdt_m_per_year').notNullable();
      t.double('dhdt_sigma_m_per_year').notNullable();
      t.double('balance_mwe_per_year').notNullable();
      t.double('balance_sigma_mwe_per_year').notNullable();
      t.double('density_kg_m3').notNullable();
      t.index(['organisation_id', 'catchment_id'], 'elevation_change_observations_catchment');
    });
  }
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('elevation_change_observations');
  await knex.schema.dropTableIfExists('snow_cover_observations');
}
