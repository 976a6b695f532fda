import type { Knex } from 'knex';

/** Hypsometry: one row per elevation band, in the melt engine's field units. */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('elevation_bands')) return;
  await knex.schema.createTable('elevation_bands', (t) => {
    t.increments('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.integer('catchment_id').unsigned().notNullable().references('catchments.id').onDelete('CASCADE');
    t.smallint('position').unsigned().notNullable();
    t.double('lower_m').notNullable();
    t.double('upper_m').notNullable();
    t.double('area_km2').notNullable();
    t.double('slope_deg').notNullable();
    t.double('aspect_deg').notNullable();
    t.double('glacier_fraction').notNullable();
    // Fraction of the band's glacier (not of the band) that is debris-covered.
    t.double('debris_fraction').notNullable();
    t.double('debris_thickness_m').notNullable();
    t.unique(['catchment_id', 'position']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('elevation_bands');
}
