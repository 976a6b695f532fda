import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { AppContext } from '../context';
import { unauthorized } from '../errors';
import type { UserRow } from '../services/auth/auth-service';
import { verifySessionToken } from '../services/auth/session-tokens';
import { TenantScope } from '../services/tenant-scope';

/**
 * The session cookie's name: `__Host-` prefixed when Secure (browsers then insist on HTTPS,
 * Path=/ and no Domain, so no sibling host can set or shadow it).
 */
export const sessionCookieName = (secure: boolean) => (secure ? '__Host-tarnish_session' : 'tarnish_session');

export interface AuthContext {
  user: UserRow;
  /** Queries through this see only the user's organisation. */
  scope: TenantScope;
}

declare module 'express-serve-static-core' {
  interface Request {
    auth?: AuthContext;
  }
}

/** Rejects requests without a valid, unrevoked session cookie; sets `req.auth`. */
export function requireAuth(ctx: AppContext): RequestHandler {
  const cookie = sessionCookieName(ctx.config.auth.cookieSecure);
  return async (req: Request, _res: Response, next: NextFunction) => {
    const token: unknown = req.cookies?.[cookie];
    if (typeof token !== 'string' || token === '') throw unauthorized();
    const claims = verifySessionToken(token, ctx.config.auth.jwtSecret, ctx.config.auth.sessionHours);
    if (!claims) throw unauthorized('Your session is not valid; please sign in again.');
    const user = await ctx.auth.activeUser(claims.userId, claims.organisationId, claims.tokenVersion);
    if (!user) throw unauthorized('Your session has ended; please sign in again.');
    req.auth = { user, scope: new TenantScope(ctx.db, user.organisation_id) };
    next();
  };
}

/** The signed-in user's context; only call behind requireAuth. */
export function authOf(req: Request): AuthContext {
  if (!req.auth) throw unauthorized();
  return req.auth;
}
