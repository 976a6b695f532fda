import type { Knex } from 'knex';

/**
 * The impurities already in a catchment's fresh snow today, which every run's baseline carries
 * (engine 2.0: the baseline is today's surface, not pristine snow). Defaults: typical values for
 * High Mountain Asia, see shared/schemas/catchments.ts (DEFAULT_BACKGROUND_LOADS).
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasColumn('catchments', 'background_black_carbon_ng_g')) return;
  await knex.schema.alterTable('catchments', (t) => {
    t.double('background_black_carbon_ng_g').notNullable().defaultTo(30);
    t.double('background_dust_ug_g').notNullable().defaultTo(10);
  });
}

export async function down(knex: Knex): Promise<void> {
  if (!(await knex.schema.hasColumn('catchments', 'background_black_carbon_ng_g'))) return;
  await knex.schema.alterTable('catchments', (t) => {
    t.dropColumn('background_black_carbon_ng_g');
    t.dropColumn('background_dust_ug_g');
  });
}
