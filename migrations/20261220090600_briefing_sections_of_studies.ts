import type { Knex } from 'knex';

/** A briefing section may show a regional study's result: the kind "regional" and the study it reads. */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasColumn('briefing_sections', 'study_id')) return;
  await knex.raw("ALTER TABLE briefing_sections MODIFY kind ENUM('chart', 'table', 'text', 'regional') NOT NULL");
  await knex.schema.alterTable('briefing_sections', (t) => {
    t.integer('study_id').unsigned().nullable().references('studies.id').onDelete('SET NULL');
  });
}

export async function down(knex: Knex): Promise<void> {
  if (!(await knex.schema.hasColumn('briefing_sections', 'study_id'))) return;
  await knex('briefing_sections').where('kind', 'regional').delete();
  await knex.schema.alterTable('briefing_sections', (t) => {
    t.dropForeign(['study_id']);
    t.dropColumn('study_id');
  });
  await knex.raw("ALTER TABLE briefing_sections MODIFY kind ENUM('chart', 'table', 'text') NOT NULL");
}
