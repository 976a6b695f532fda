import type { Knex } from 'knex';

/** The regional chart over time shows months of a season study or years of a multi-decade one: its key says "by period". */
export async function up(knex: Knex): Promise<void> {
  await knex('briefing_sections').where({ kind: 'regional', content_key: 'regional-by-month' }).update({ content_key: 'regional-by-period' });
}

export async function down(knex: Knex): Promise<void> {
  await knex('briefing_sections').where({ kind: 'regional', content_key: 'regional-by-period' }).update({ content_key: 'regional-by-month' });
}
