import type { Knex } from 'knex';

/** Uploaded files waiting for the user to confirm the preview; removed on confirm, discard or expiry. */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('pending_uploads')) return;
  await knex.schema.createTable('pending_uploads', (t) => {
    t.increments('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.integer('catchment_id').unsigned().notNullable().references('catchments.id').onDelete('CASCADE');
    t.integer('user_id').unsigned().notNullable().references('users.id').onDelete('CASCADE');
    t.string('token', 64).notNullable().unique();
    t.string('file_name', 255).notNullable();
    // The upload form's fields (variable, unit, time step, provenance) as JSON.
    t.text('fields').notNullable();
    // The file as uploaded, gzip-compressed.
    t.specificType('content_gz', 'LONGBLOB').notNullable();
    t.timestamp('expires_at').notNullable();
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.index(['expires_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('pending_uploads');
}
