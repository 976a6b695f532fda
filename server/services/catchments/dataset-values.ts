import type { Knex } from 'knex';
import type { StakeReading } from '../../../shared/schemas/stakes';

/** Rows per INSERT: 4 placeholders each keeps a statement far below MySQL's 65,535-placeholder limit. */
export const INSERT_CHUNK_ROWS = 10_000;

/** Inserts a series' values in chunks; call inside the transaction that creates the dataset. */
export async function insertDatasetValues(
  trx: Knex | Knex.Transaction,
  ids: { datasetId: number; organisationId: number },
  times: readonly string[],
  values: readonly number[],
): Promise<void> {
  for (let start = 0; start < times.length; start += INSERT_CHUNK_ROWS) {
    const end = Math.min(start + INSERT_CHUNK_ROWS, times.length);
    const rows = new Array(end - start);
    for (let i = start; i < end; i++) {
      rows[i - start] = { dataset_id: ids.datasetId, organisation_id: ids.organisationId, t: times[i], value: values[i] };
    }
    await trx('dataset_values').insert(rows);
  }
}

/** Values of a dataset between two local times (inclusive), as 'YYYY-MM-DD HH:mm' strings. */
export async function readDatasetValues(
  db: Knex | Knex.Transaction,
  ids: { datasetId: number; organisationId: number },
  range: { from?: string; to?: string } = {},
): Promise<{ t: string; value: number }[]> {
  const query = db('dataset_values')
    .where({ dataset_id: ids.datasetId, organisation_id: ids.organisationId })
    .select(db.raw("DATE_FORMAT(t, '%Y-%m-%d %H:%i') as t"), 'value')
    .orderBy('dataset_values.t');
  if (range.from) query.where('dataset_values.t', '>=', range.from);
  if (range.to) query.where('dataset_values.t', '<=', range.to);
  return query;
}

/** Inserts stake readings (few rows per file: one statement). */
export async function insertStakeReadings(
  db: Knex | Knex.Transaction,
  ids: { datasetId: number; organisationId: number },
  readings: readonly StakeReading[],
): Promise<void> {
  await db('stake_readings').insert(readings.map((r) => ({
    dataset_id: ids.datasetId, organisation_id: ids.organisationId, stake: r.stake, elevation_m: r.elevationM,
    period_start: r.from, period_end: r.to, balance_m_we: r.balanceMWe,
  })));
}

/** Stake readings of a dataset, by elevation and period. */
export async function readStakeReadings(db: Knex | Knex.Transaction, ids: { datasetId: number; organisationId: number }): Promise<StakeReading[]> {
  return db('stake_readings')
    .where({ dataset_id: ids.datasetId, organisation_id: ids.organisationId })
    .select('stake', { elevationM: 'elevation_m' }, { balanceMWe: 'balance_m_we' },
      db.raw("DATE_FORMAT(period_start, '%Y-%m-%d') as `from`"), db.raw("DATE_FORMAT(period_end, '%Y-%m-%d') as `to`"))
    .orderBy([{ column: 'elevation_m' }, { column: 'period_start' }]);
}
