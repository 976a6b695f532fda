import type { Knex } from 'knex';
import type { AppConfig } from '../../config';
import { AuthService } from './auth-service';

export interface AuthServices {
  auth: AuthService;
}

/** Sign-up, sign-in and sessions. bcrypt costs 12 in production, 10 elsewhere unless given. */
export function createAuthServices(deps: { config: AppConfig; db: Knex; bcryptCost?: number }): AuthServices {
  const cost = deps.bcryptCost ?? (deps.config.env === 'production' ? 12 : 10);
  return { auth: new AuthService(deps.db, cost) };
}
