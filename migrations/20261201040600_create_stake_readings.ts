import type { Knex } from 'knex';

/** Point mass balance from stakes: one reading per stake and period, in m water equivalent. */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('stake_readings')) return;
  await knex.schema.createTable('stake_readings', (t) => {
    t.increments('id').primary();
    t.integer('dataset_id').unsigned().notNullable().references('datasets.id').onDelete('CASCADE');
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.string('stake', 60).notNullable();
    t.double('elevation_m').notNullable();
    t.date('period_start').notNullable();
    t.date('period_end').notNullable();
    t.double('balance_m_we').notNullable();
    t.unique(['dataset_id', 'stake', 'period_start']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('stake_readings');
}
