import type { Knex } from 'knex';

/**
 * Geodata files of a catchment (the file itself is kept in the geodata store, named by this row):
 * a DEM, the catchment, glacier and debris outlines, a debris-thickness raster (the newest of
 * each is in use), dated snow-cover maps and elevation-change rasters. `summary` holds what was
 * read from the file (system, grid, nodata, notices, class codes, dates).
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('geodata_uploads')) return;
  await knex.schema.createTable('geodata_uploads', (t) => {
    t.increments('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.integer('catchment_id').unsigned().notNullable().references('catchments.id').onDelete('CASCADE');
    t.enum('kind', ['dem', 'catchmentOutline', 'glacierOutline', 'debrisOutline', 'debrisThickness', 'snowCover', 'elevationChange']).notNullable();
    t.string('file_name', 255).notNullable();
    t.bigInteger('byte_size').unsigned().notNullable();
    t.string('stored_name', 100).notNullable();
    t.date('observed_on').nullable();
    t.json('summary').notNullable();
    t.integer('uploaded_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.index(['organisation_id', 'catchment_id', 'kind']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('geodata_uploads');
}
