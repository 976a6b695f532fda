import type { Knex } from 'knex';

/**
 * One simulation of a run: the scenario itself, its baseline, a factor-separation combination
 * (mask of drivers switched on) or an ensemble member (index), with the parameters it used.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('run_members')) return;
  await knex.schema.createTable('run_members', (t) => {
    t.increments('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.integer('run_id').unsigned().notNullable().references('runs.id').onDelete('CASCADE');
    t.string('member_key', 40).notNullable();
    t.enum('kind', ['scenario', 'baseline', 'combination', 'ensemble-scenario', 'ensemble-baseline']).notNullable();
    t.smallint('combination_mask').unsigned().nullable();
    t.smallint('ensemble_index').unsigned().nullable();
    t.json('parameters').notNullable();
    t.date('start_date').notNullable();
    t.integer('day_count').unsigned().notNullable();
    // [{ elevationM, areaM2 }] per band, as simulated (debris changes do not move bands).
    t.json('bands').notNullable();
    t.unique(['run_id', 'member_key']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('run_members');
}
