import type { Knex } from 'knex';

/**
 * Many catchments over one DEM, before they are made: the uploaded DEM and outline files (kept in
 * the geodata store under `files`), the derivation options, and where reading them stands
 * (reading → ready | failed). `claimed_at` marks the one confirm that made the catchments; the row
 * stays until it expires, so a later confirm is told they were made (409), not that it never existed.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('pending_outline_batches')) return;
  await knex.schema.createTable('pending_outline_batches', (t) => {
    t.increments('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.integer('study_id').unsigned().notNullable().references('studies.id').onDelete('CASCADE');
    t.integer('user_id').unsigned().notNullable().references('users.id').onDelete('CASCADE');
    t.string('token', 64).notNullable().unique();
    t.enum('status', ['reading', 'ready', 'failed']).notNullable();
    // { climateFromCatchmentId, bandWidthM, splitByAspect, horizonSectors, debrisThicknessM? } (shared/schemas/outline-batches.ts)
    t.json('options').notNullable();
    // Per layer: the stored name, the name it was uploaded with, its size and what was read from it.
    t.json('files').notNullable();
    t.integer('outline_count').unsigned().notNullable();
    // Outlines read to the end: derived, or refused with their problem.
    t.integer('done_count').unsigned().notNullable().defaultTo(0);
    t.text('error_message').nullable();
    t.timestamp('claimed_at').nullable();
    t.timestamp('expires_at').notNullable();
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.index(['organisation_id', 'study_id']);
    t.index(['status']);
    t.index(['expires_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('pending_outline_batches');
}
