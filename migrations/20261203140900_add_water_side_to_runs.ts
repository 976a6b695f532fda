import type { Knex } from 'knex';

/**
 * The water side a run was simulated with (band climate from the stations' gradients, the
 * water-balance precipitation, snow redistribution, routing, the initial glacier), as JSON, so its
 * set-up can be stated with its results; runs made before keep NULL.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasColumn('runs', 'water_side')) return;
  await knex.schema.alterTable('runs', (t) => {
    t.json('water_side').nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  if (await knex.schema.hasColumn('runs', 'water_side')) await knex.schema.alterTable('runs', (t) => t.dropColumn('water_side'));
}
