import type { Knex } from 'knex';

/** The lab's water-balance closure runs as a job of its own kind. */
export async function up(knex: Knex): Promise<void> {
  await knex.raw("ALTER TABLE lab_jobs MODIFY kind ENUM('sweep', 'calibration', 'water-balance') NOT NULL");
}

/** Jobs of the removed kind go with it (they are results that can be computed again). */
export async function down(knex: Knex): Promise<void> {
  await knex('lab_jobs').where('kind', 'water-balance').delete();
  await knex.raw("ALTER TABLE lab_jobs MODIFY kind ENUM('sweep', 'calibration') NOT NULL");
}
