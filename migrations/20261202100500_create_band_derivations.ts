import type { Knex } from 'knex';

/**
 * Bands derived from a catchment's DEM and outlines: the options, the uploads used, the derived
 * table with its hypsometry and notices (`result`), and the map drawn from it (`map`: grid,
 * system, outlines; the hillshade and the cell layers are files in the geodata store).
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('band_derivations')) return;
  await knex.schema.createTable('band_derivations', (t) => {
    t.increments('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.integer('catchment_id').unsigned().notNullable().references('catchments.id').onDelete('CASCADE');
    t.json('options').notNullable();
    t.json('upload_ids').notNullable();
    t.json('result').notNullable();
    t.json('map').notNullable();
    t.string('stored_prefix', 100).notNullable();
    t.double('seconds').notNullable();
    t.integer('created_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.index(['organisation_id', 'catchment_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('band_derivations');
}
