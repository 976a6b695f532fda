import type { Knex } from 'knex';
import type { AppConfig } from '../../config';
import { SignInBackoff } from '../../middleware/sign-in-limits';
import { AuthService } from './auth-service';

export interface AuthServices {
  auth: AuthService;
  /** Slows down sign-ins (and password changes) after failures on one account. */
  signInBackoff: SignInBackoff;
}

/** Sign-up, sign-in and sessions. bcrypt costs 12 in production, 10 elsewhere unless given. */
export function createAuthServices(deps: { config: AppConfig; db: Knex; bcryptCost?: number }): AuthServices {
  const cost = deps.bcryptCost ?? (deps.config.env === 'production' ? 12 : 10);
  const limits = deps.config.auth.signInLimits;
  return {
    auth: new AuthService(deps.db, cost),
    signInBackoff: new SignInBackoff({ freeFailures: limits.perAccount, baseDelayMs: limits.backoffBaseMs, maxDelayMs: limits.backoffMaxMs }),
  };
}
