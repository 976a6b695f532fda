import type { Knex } from 'knex';

/**
 * The catchment list (one organisation, archived or not, by name) read in index order, without
 * sorting: EXPLAIN showed "Using filesort" on (organisation_id, archived_at).
 */
const INDEX = 'catchments_organisation_archived_name_index';

export async function up(knex: Knex): Promise<void> {
  const [rows] = await knex.raw('SHOW INDEX FROM catchments WHERE Key_name = ?', [INDEX]);
  if ((rows as unknown[]).length > 0) return;
  await knex.schema.alterTable('catchments', (t) => {
    t.index(['organisation_id', 'archived_at', 'name'], INDEX);
  });
}

export async function down(knex: Knex): Promise<void> {
  const [rows] = await knex.raw('SHOW INDEX FROM catchments WHERE Key_name = ?', [INDEX]);
  if ((rows as unknown[]).length === 0) return;
  await knex.schema.alterTable('catchments', (t) => {
    t.dropIndex(['organisation_id', 'archived_at', 'name'], INDEX);
  });
}
