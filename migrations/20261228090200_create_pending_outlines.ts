import type { Knex } from 'knex';

/**
 * The outlines of a pending batch, one row per feature of the outline file: its name, the outline
 * alone as GeoJSON (null when its geometry is unusable), what the preview shows (`summary`: area,
 * elevation range, band count, problems), and once derived the bands, terrain shading and map
 * geometry (`derived_gz`, gzip-compressed JSON; the map images are files named `stored_prefix`).
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('pending_outlines')) return;
  await knex.schema.createTable('pending_outlines', (t) => {
    t.increments('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.integer('batch_id').unsigned().notNullable().references('pending_outline_batches.id').onDelete('CASCADE');
    t.integer('feature_number').unsigned().notNullable();
    t.string('name', 255).nullable();
    t.specificType('outline_geojson', 'LONGTEXT').nullable();
    t.json('summary').notNullable();
    t.specificType('derived_gz', 'LONGBLOB').nullable();
    t.string('stored_prefix', 100).nullable();
    t.unique(['batch_id', 'feature_number']);
    t.index(['organisation_id', 'batch_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('pending_outlines');
}
