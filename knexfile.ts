import type { Knex } from 'knex';
import { loadConfig } from './server/config';

const { db } = loadConfig();

/** Used by the knex CLI (`npm run migrate`, `npm run seed`); the app builds its own pool in server/db.ts. */
const config: Knex.Config = {
  client: 'mysql2',
  connection: { host: db.host, port: db.port, user: db.user, password: db.password, database: db.database, decimalNumbers: true, timezone: 'Z' },
  migrations: { directory: './migrations', extension: 'ts', loadExtensions: ['.ts'] },
  seeds: { directory: './seeds', extension: 'ts', loadExtensions: ['.ts'] },
};

export default config;
