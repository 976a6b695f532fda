import knex, { type Knex } from 'knex';
import type { AppConfig } from './config';
import { safeError, type Logger } from './logger';

/**
 * Knex's own warnings (a connection that could not be acquired, a pool error) go to the log by
 * their first words only: its messages can carry a statement and its values.
 */
function knexLog(logger: Logger) {
  const brief = (message: unknown) => (message instanceof Error ? { err: safeError(message) } : { note: String(message).split(/[:\n]/)[0] });
  return {
    warn: (message: unknown) => logger.warn({ source: 'knex', ...brief(message) }, 'database warning'),
    error: (message: unknown) => logger.error({ source: 'knex', ...brief(message) }, 'database error'),
    deprecate: (method: string, alternative: string) => logger.warn({ source: 'knex', method, alternative }, 'deprecated database call'),
    debug: () => undefined,
  };
}

/** A Knex pool on MariaDB. DECIMAL columns come back as numbers, times as UTC. */
export function createDb(db: AppConfig['db'], logger?: Logger): Knex {
  return knex({
    ...(logger ? { log: knexLog(logger) } : {}),
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
