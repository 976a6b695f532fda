import type { Knex } from 'knex';

async function precisionOf(knex: Knex, column: string): Promise<number> {
  const [rows] = await knex.raw(
    'SELECT DATETIME_PRECISION AS p FROM information_schema.COLUMNS WHERE TABLE_SCHEMA = DATABASE() AND TABLE_NAME = ? AND COLUMN_NAME = ?',
    ['runs', column],
  );
  return Number((rows as { p: number }[])[0]?.p ?? 0);
}

/** Run timings to the millisecond: a season runs in about a second, so whole seconds say little. */
export async function up(knex: Knex): Promise<void> {
  if ((await precisionOf(knex, 'started_at')) === 3) return;
  await knex.raw(`ALTER TABLE runs
    MODIFY queued_at TIMESTAMP(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
    MODIFY started_at TIMESTAMP(3) NULL DEFAULT NULL,
    MODIFY finished_at TIMESTAMP(3) NULL DEFAULT NULL`);
}

export async function down(knex: Knex): Promise<void> {
  if ((await precisionOf(knex, 'started_at')) === 0) return;
  await knex.raw(`ALTER TABLE runs
    MODIFY queued_at TIMESTAMP NOT NULL DEFAULT CURRENT_TIMESTAMP,
    MODIFY started_at TIMESTAMP NULL DEFAULT NULL,
    MODIFY finished_at TIMESTAMP NULL DEFAULT NULL`);
}
