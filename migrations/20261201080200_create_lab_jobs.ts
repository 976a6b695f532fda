import type { Knex } from 'knex';

/** Sweeps and automatic calibrations from the lab: one row per job with its request, progress and result. */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('lab_jobs')) return;
  await knex.schema.createTable('lab_jobs', (t) => {
    t.increments('id').primary();
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.integer('catchment_id').unsigned().notNullable().references('catchments.id').onDelete('CASCADE');
    t.enum('kind', ['sweep', 'calibration']).notNullable();
    t.enum('status', ['queued', 'running', 'done', 'failed', 'cancelled']).notNullable().defaultTo('queued');
    t.double('progress').notNullable().defaultTo(0);
    t.string('message', 500).notNullable().defaultTo('');
    t.json('request').notNullable();
    t.json('result').nullable();
    t.text('error_message').nullable();
    t.integer('created_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.string('created_by_name', 120).notNullable();
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.timestamp('finished_at').nullable();
    t.index(['organisation_id', 'catchment_id', 'created_at']);
    t.index(['status']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('lab_jobs');
}
