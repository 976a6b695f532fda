import type { Knex } from 'knex';

/**
 * Band tables as versions: every save of a catchment's band table is a new version, the newest is
 * the one in use, and older versions stay for the runs made with them. Existing bands become
 * version 1 of their catchment (set-based), and bands are numbered within their version.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('band_tables')) return;
  await knex.schema.createTable('band_tables', (t) => {
    t.increments('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.integer('catchment_id').unsigned().notNullable().references('catchments.id').onDelete('CASCADE');
    t.integer('version').unsigned().notNullable();
    // 'entered': typed, pasted or read from CSV; 'derived': from a DEM and outlines.
    t.enum('source', ['entered', 'derived']).notNullable().defaultTo('entered');
    t.integer('derivation_id').unsigned().nullable();
    t.integer('created_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.unique(['catchment_id', 'version']);
    t.index(['organisation_id']);
  });
  await knex.raw(`INSERT INTO band_tables (organisation_id, catchment_id, version, source)
    SELECT organisation_id, catchment_id, 1, 'entered' FROM elevation_bands GROUP BY organisation_id, catchment_id`);
  await knex.schema.alterTable('elevation_bands', (t) => {
    t.integer('band_table_id').unsigned().nullable().references('band_tables.id').onDelete('CASCADE');
  });
  await knex.raw('UPDATE elevation_bands e JOIN band_tables t ON t.catchment_id = e.catchment_id SET e.band_table_id = t.id');
  await knex.raw('ALTER TABLE elevation_bands MODIFY band_table_id INT UNSIGNED NOT NULL');
  await knex.schema.alterTable('elevation_bands', (t) => {
    t.unique(['band_table_id', 'position']);
    t.index(['catchment_id']);
  });
  await knex.schema.alterTable('elevation_bands', (t) => t.dropUnique(['catchment_id', 'position']));
}

/** Back to one table per catchment: only the newest version of each catchment is kept. */
export async function down(knex: Knex): Promise<void> {
  if (!(await knex.schema.hasTable('band_tables'))) return;
  await knex.raw(`DELETE e FROM elevation_bands e JOIN band_tables t ON t.id = e.band_table_id
    WHERE t.version < (SELECT MAX(n.version) FROM (SELECT catchment_id, version FROM band_tables) n WHERE n.catchment_id = t.catchment_id)`);
  await knex.schema.alterTable('elevation_bands', (t) => t.unique(['catchment_id', 'position']));
  await knex.schema.alterTable('elevation_bands', (t) => {
    t.dropForeign(['band_table_id']);
    t.dropUnique(['band_table_id', 'position']);
    t.dropIndex(['catchment_id']);
  });
  await knex.schema.alterTable('elevation_bands', (t) => t.dropColumn('band_table_id'));
  await knex.schema.dropTable('band_tables');
}
