import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('briefings')) return;
  await knex.schema.createTable('briefings', (t) => {
    t.increments('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.integer('catchment_id').unsigned().notNullable().references('catchments.id').onDelete('RESTRICT');
    t.string('title', 160).notNullable();
    t.text('summary').notNullable();
    // Which runs the draft draws on: { baselineRunId, variantRunIds } (shared/schemas/briefings.ts).
    t.json('selection').notNullable();
    // Number of the latest published version; 0 while only a draft exists.
    t.integer('latest_version').unsigned().notNullable().defaultTo(0);
    t.integer('created_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.timestamps(true, true);
    t.index(['organisation_id', 'updated_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('briefings');
}
