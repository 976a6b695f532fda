import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('briefing_versions')) return;
  await knex.schema.createTable('briefing_versions', (t) => {
    t.increments('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.integer('briefing_id').unsigned().notNullable().references('briefings.id').onDelete('CASCADE');
    t.integer('version').unsigned().notNullable();
    // Everything the version shows, frozen at publication (briefingSnapshotSchema); never updated.
    t.specificType('snapshot', 'longtext').notNullable();
    t.integer('published_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('published_at').notNullable().defaultTo(knex.fn.now());
    t.unique(['briefing_id', 'version']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('briefing_versions');
}
