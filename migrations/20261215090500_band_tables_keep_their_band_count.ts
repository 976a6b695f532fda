import type { Knex } from 'knex';

/**
 * Each band table version keeps how many bands it holds (a version never changes once written), so
 * the catchment list reads one row per catchment instead of counting the bands of its newest version
 * through a nested subquery, which made the signed-in list two and a half times as costly.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasColumn('band_tables', 'band_count')) return;
  await knex.schema.alterTable('band_tables', (t) => {
    t.integer('band_count').unsigned().notNullable().defaultTo(0);
  });
  await knex.raw('UPDATE band_tables t SET band_count = (SELECT COUNT(*) FROM elevation_bands e WHERE e.band_table_id = t.id)');
}

export async function down(knex: Knex): Promise<void> {
  if (!(await knex.schema.hasColumn('band_tables', 'band_count'))) return;
  await knex.schema.alterTable('band_tables', (t) => {
    t.dropColumn('band_count');
  });
}
