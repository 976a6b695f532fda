import type { Knex } from 'knex';

/** Catchment daily runoff volume (m³) by source of one run member; day 0 is the member's start date. */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('run_daily')) return;
  await knex.schema.createTable('run_daily', (t) => {
    t.bigIncrements('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.integer('member_id').unsigned().notNullable().references('run_members.id').onDelete('CASCADE');
    t.integer('day_index').unsigned().notNullable();
    t.double('snow_m3').notNullable();
    t.double('ice_m3').notNullable();
    t.double('debris_ice_m3').notNullable();
    t.double('rain_m3').notNullable();
    t.unique(['member_id', 'day_index']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('run_daily');
}
