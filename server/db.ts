import knex, { type Knex } from 'knex';
import type { AppConfig } from './config';

/** A Knex pool on MariaDB. DECIMAL columns come back as numbers, times as UTC. */
export function createDb(db: AppConfig['db']): Knex {
  return knex({
    client: 'mysql2',
    connection: {
      host: db.host,
      port: db.port,
      user: db.user,
      password: db.password,
      database: db.database,
      decimalNumbers: true,
      timezone: 'Z',
      dateStrings: false,
      connectTimeout: 2000,
    },
    pool: { min: 0, max: db.poolMax },
    acquireConnectionTimeout: 5000,
  });
}

/** True when the database answers a trivial query. */
export async function databaseAnswers(db: Knex): Promise<boolean> {
  try {
    await db.raw('select 1');
    return true;
  } catch {
    return false;
  }
}
