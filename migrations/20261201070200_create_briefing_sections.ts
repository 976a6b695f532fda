import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('briefing_sections')) return;
  await knex.schema.createTable('briefing_sections', (t) => {
    t.increments('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.integer('briefing_id').unsigned().notNullable().references('briefings.id').onDelete('CASCADE');
    t.integer('position').unsigned().notNullable();
    t.enum('kind', ['chart', 'table', 'text']).notNullable();
    t.string('heading', 160).notNullable();
    // Which result chart or table the section shows (chart and table sections).
    t.string('content_key', 40).nullable();
    t.string('caption', 500).notNullable().defaultTo('');
    // Narrative in Markdown (text sections); rendered through the sanitiser only.
    t.text('body_markdown').nullable();
    t.unique(['briefing_id', 'position']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('briefing_sections');
}
