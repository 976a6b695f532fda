import type { Knex } from 'knex';

/**
 * Bands derived from a DEM may be split by aspect into response units that share an elevation
 * range (north, east, south, west), and carry the engine's terrain shading: the sky-view factor
 * and the horizon percentiles per azimuth sector (JSON, sectors × 5 angles in degrees).
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasColumn('elevation_bands', 'aspect_class')) return;
  await knex.schema.alterTable('elevation_bands', (t) => {
    t.enum('aspect_class', ['N', 'E', 'S', 'W']).nullable();
    t.double('sky_view_factor').nullable();
    t.json('horizon_deg').nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  if (!(await knex.schema.hasColumn('elevation_bands', 'aspect_class'))) return;
  await knex.schema.alterTable('elevation_bands', (t) => {
    t.dropColumn('aspect_class');
    t.dropColumn('sky_view_factor');
    t.dropColumn('horizon_deg');
  });
}
