import type { Knex } from 'knex';

/** A multi-decade (transient) run keeps its warming path and record years as requested; season runs keep NULL. */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasColumn('runs', 'transient_options')) return;
  await knex.schema.alterTable('runs', (t) => {
    t.json('transient_options').nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  if (await knex.schema.hasColumn('runs', 'transient_options')) await knex.schema.alterTable('runs', (t) => t.dropColumn('transient_options'));
}
