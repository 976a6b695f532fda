import type { Knex } from 'knex';

/**
 * A pending upload keeps the file as read and checked at preview (gzip-compressed JSON of the
 * preview and the values), so confirming stores it without reading the file again. Pending
 * uploads live an hour at most: those waiting when this runs are dropped (uploaded again).
 * `claimed_at` marks the one confirm that stores it; the row stays until it expires, so a later
 * confirm of the same preview is told it was stored (409), not that it never existed.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasColumn('pending_uploads', 'read_gz')) return;
  await knex('pending_uploads').delete();
  if (await knex.schema.hasColumn('pending_uploads', 'content_gz')) {
    await knex.schema.alterTable('pending_uploads', (t) => {
      t.dropColumn('content_gz');
    });
  }
  await knex.schema.alterTable('pending_uploads', (t) => {
    t.specificType('read_gz', 'LONGBLOB').notNullable();
    t.timestamp('claimed_at').nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  if (await knex.schema.hasColumn('pending_uploads', 'content_gz')) return;
  await knex('pending_uploads').delete();
  for (const column of ['read_gz', 'claimed_at']) {
    if (await knex.schema.hasColumn('pending_uploads', column)) {
      await knex.schema.alterTable('pending_uploads', (t) => {
        t.dropColumn(column);
      });
    }
  }
  await knex.schema.alterTable('pending_uploads', (t) => {
    t.specificType('content_gz', 'LONGBLOB').notNullable();
  });
}
