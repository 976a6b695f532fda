import type { Knex } from 'knex';

/**
 * A dataset belongs to the station that recorded it (observations at the outlet or on the glacier
 * may belong to none). Climate series stored before stations existed came from the catchment's
 * one station, now its reference station.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasColumn('datasets', 'station_id')) return;
  await knex.schema.alterTable('datasets', (t) => {
    t.integer('station_id').unsigned().nullable().references('stations.id').onDelete('RESTRICT');
  });
  await knex.raw(`UPDATE datasets d JOIN stations s ON s.catchment_id = d.catchment_id AND s.is_reference = 1
    SET d.station_id = s.id WHERE d.kind = 'climate'`);
}

export async function down(knex: Knex): Promise<void> {
  if (!(await knex.schema.hasColumn('datasets', 'station_id'))) return;
  await knex.schema.alterTable('datasets', (t) => {
    t.dropForeign(['station_id']);
    t.dropColumn('station_id');
  });
}
