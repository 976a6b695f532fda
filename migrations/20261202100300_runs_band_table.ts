import type { Knex } from 'knex';

/** A run points to the band table version it was made with; existing runs get their catchment's version 1. */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasColumn('runs', 'band_table_id')) return;
  await knex.schema.alterTable('runs', (t) => {
    t.integer('band_table_id').unsigned().nullable().references('band_tables.id').onDelete('SET NULL');
  });
  await knex.raw('UPDATE runs r JOIN band_tables t ON t.catchment_id = r.catchment_id AND t.version = 1 SET r.band_table_id = t.id');
}

export async function down(knex: Knex): Promise<void> {
  if (!(await knex.schema.hasColumn('runs', 'band_table_id'))) return;
  await knex.schema.alterTable('runs', (t) => {
    t.dropForeign(['band_table_id']);
    t.dropColumn('band_table_id');
  });
}
