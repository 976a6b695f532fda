import type { Express } from 'express';
import type { Knex } from 'knex';
import { createApp } from '../../server/app';
import { parseConfig, type AppConfig } from '../../server/config';
import { createContext, type AppContext, type ContextOptions } from '../../server/context';
import { createDb } from '../../server/db';
import { createLogger } from '../../server/logger';

export interface TestApp {
  app: Express;
  ctx: AppContext;
  db: Knex;
  config: AppConfig;
  close(): Promise<void>;
}

/**
 * An app on the test database prepared by `npm test` (scripts/test.sh). Refuses any
 * database whose name does not end in `_test`, so tests never touch the demo data.
 */
export function createTestApp(overrides: Record<string, string> = {}, contextOptions: ContextOptions = {}): TestApp {
  const config = parseConfig({ ...process.env, NODE_ENV: 'test', ...overrides });
  if (!config.db.database.endsWith('_test')) {
    throw new Error(`Tests must run on a *_test database (got "${config.db.database}"); use npm test.`);
  }
  const logger = createLogger(config.log);
  const db = createDb(config.db, logger);
  const ctx = createContext(config, db, { bcryptCost: 4, logger, ...contextOptions });
  const app = createApp(ctx, { clientDir: overrides.CLIENT_DIR });
  const close = async () => {
    // Runs and lab jobs write to the database until they end; then the threads and the database can go.
    await ctx.close();
    await db.destroy();
  };
  return { app, ctx, db, config, close };
}
