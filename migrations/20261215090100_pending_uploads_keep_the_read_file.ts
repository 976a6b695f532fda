import type { Knex } from 'knex';

/**
 * A pending upload keeps the file as read and checked at preview (gzip-compressed JSON of the
 * preview and the values), so confirming stores it without reading the file again. Pending
 * uploads live an hour at most: those waiting when this runs are dropped (uploaded again).
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasColumn('pending_uploads', 'read_gz')) return;
  await knex('pending_uploads').delete();
  await knex.schema.alterTable('pending_uploads', (t) => {
    t.dropColumn('content_gz');
  });
  await knex.schema.alterTable('pending_uploads', (t) => {
    t.specificType('read_gz', 'LONGBLOB').notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  if (!(await knex.schema.hasColumn('pending_uploads', 'read_gz'))) return;
  await knex('pending_uploads').delete();
  await knex.schema.alterTable('pending_uploads', (t) => {
    t.dropColumn('read_gz');
  });
  await knex.schema.alterTable('pending_uploads', (t) => {
    t.specificType('content_gz', 'LONGBLOB').notNullable();
  });
}
