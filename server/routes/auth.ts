import type { CookieOptions, Response } from 'express';
import { signInSchema, signUpSchema } from '../../shared/schemas/auth';
import type { AppContext } from '../context';
import { SESSION_COOKIE } from '../middleware/require-auth';
import { signInLimits } from '../middleware/sign-in-limits';
import type { UserRow } from '../services/auth/auth-service';
import { signSessionToken } from '../services/auth/session-tokens';
import { memberArea, publicArea, type ApiArea } from './route-table';

/** /api/auth/* and /api/me: sign-up and sign-in (public), sign-out and the current user. */
export function authRoutes(ctx: AppContext): ApiArea[] {
  const { auth, config } = ctx;

  const cookieOptions = (): CookieOptions => ({
    httpOnly: true,
    sameSite: 'lax',
    secure: config.auth.cookieSecure,
    path: '/',
    maxAge: config.auth.sessionHours * 3600_000,
  });

  const startSession = async (res: Response, user: UserRow) => {
    const token = signSessionToken(
      { userId: user.id, organisationId: user.organisation_id, tokenVersion: user.token_version },
      config.auth.jwtSecret,
      config.auth.sessionHours,
    );
    res.cookie(SESSION_COOKIE, token, cookieOptions());
    res.json(await auth.me(user));
  };

  const signing = publicArea('/auth', (route) => {
    route.post('/sign-up', { body: signUpSchema }, async ({ body }, res) => {
      const user = await auth.signUp(body);
      res.status(201);
      await startSession(res, user);
    });

    route.post('/sign-in', { before: signInLimits(config.auth.signInLimits), body: signInSchema }, async ({ body }, res) => {
      await startSession(res, await auth.signIn(body));
    });
  });

  const session = memberArea('/auth', (route) => {
    route.post('/sign-out', 'signedIn', {}, async ({ auth: { user } }, res) => {
      await auth.signOut(user.id);
      const { maxAge: _unused, ...clear } = cookieOptions();
      res.clearCookie(SESSION_COOKIE, clear);
      res.status(204).end();
    });
  });

  const me = memberArea('/me', (route) => {
    route.get('/', 'signedIn', {}, async ({ auth: { user } }, res) => {
      res.json(await auth.me(user));
    });
  });

  return [signing, session, me];
}
