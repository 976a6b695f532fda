import type { Knex } from 'knex';
import type { AppConfig } from './config';
import { AuthService } from './services/auth-service';

/** Everything the routes need, built once per app so tests can build their own. */
export interface AppContext {
  config: AppConfig;
  db: Knex;
  auth: AuthService;
}

export interface ContextOptions {
  /** bcrypt work factor; 12 in production, lower locally to keep tests quick. */
  bcryptCost?: number;
}

export function createContext(config: AppConfig, db: Knex, options: ContextOptions = {}): AppContext {
  const bcryptCost = options.bcryptCost ?? (config.env === 'production' ? 12 : 10);
  return { config, db, auth: new AuthService(db, bcryptCost) };
}
