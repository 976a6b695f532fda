import type { Knex } from 'knex';

/**
 * What a run's workers simulate, stored once with the run (gzip-compressed structured-clone bytes
 * of the catchment, its forcing, the start and every member's plan): any worker process, on any
 * machine, can take any member of the run, and a member retried after a fault sees the same inputs.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('run_inputs')) return;
  await knex.schema.createTable('run_inputs', (t) => {
    t.integer('run_id').unsigned().primary().references('runs.id').onDelete('CASCADE');
    t.integer('organisation_id').unsigned().notNullable().references('organisations.id').onDelete('CASCADE');
    t.specificType('inputs_gz', 'LONGBLOB').notNullable();
    t.index(['organisation_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('run_inputs');
}
