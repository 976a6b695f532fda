import type { CookieOptions, Response } from 'express';
import { passwordChangeSchema, signInSchema, SIGN_UP_REPLY, signUpSchema } from '../../shared/schemas/auth';
import { signUpConfirmSchema } from '../../shared/schemas/members';
import type { AppContext } from '../context';
import { authOf, sessionCookieName } from '../middleware/require-auth';
import { WRONG_PASSWORD_STATUS } from '../services/auth/auth-service';
import { signInLimits, signUpLimits } from '../middleware/sign-in-limits';
import type { UserRow } from '../services/auth/auth-service';
import { signSessionToken } from '../services/auth/session-tokens';
import { memberArea, publicArea, type ApiArea } from './route-table';

/** /api/auth/* and /api/me: sign-up and sign-in (public), sign-out, password change and the current user. */
export function authRoutes(ctx: AppContext): ApiArea[] {
  const { auth, config } = ctx;

  const cookieOptions = (): CookieOptions => ({
    httpOnly: true,
    sameSite: 'lax',
    secure: config.auth.cookieSecure,
    path: '/',
    maxAge: config.auth.sessionHours * 3600_000,
  });

  const cookie = sessionCookieName(config.auth.cookieSecure);
  const startSession = async (res: Response, user: UserRow) => {
    const token = signSessionToken(
      { userId: user.id, organisationId: user.organisation_id, tokenVersion: user.token_version },
      config.auth.jwtSecret,
      config.auth.sessionHours,
    );
    res.cookie(cookie, token, cookieOptions());
    res.json(await auth.me(user));
  };

  const signing = publicArea('/auth', (route) => {
    // One answer whether the address is new or taken; its owner learns which by mail.
    route.post('/sign-up', { before: signUpLimits(config.auth.signUpLimits), body: signUpSchema }, async ({ body }, res) => {
      await ctx.signUps.request(body);
      res.status(202).json({ message: SIGN_UP_REPLY });
    });

    route.post('/sign-up/confirm', { body: signUpConfirmSchema }, async ({ body }, res) => {
      await startSession(res, await ctx.signUps.confirm(body.token));
    });

    route.post('/sign-in', { before: signInLimits(config.auth.signInLimits, ctx.signInBackoff), body: signInSchema }, async ({ body }, res) => {
      await startSession(res, await auth.signIn(body));
    });
  });

  const session = memberArea('/auth', (route) => {
    route.post('/sign-out', 'signedIn', {}, async ({ auth: { user } }, res) => {
      await auth.signOut(user.id);
      const { maxAge: _unused, ...clear } = cookieOptions();
      res.clearCookie(cookie, clear);
      res.status(204).end();
    });

    // Every other session of the user ends; this one goes on with a new cookie.
    route.post('/password', 'signedIn', { before: [ctx.signInBackoff.guard((req) => `account:${authOf(req).user.email}`, WRONG_PASSWORD_STATUS)], body: passwordChangeSchema }, async ({ auth: { user }, body }, res) => {
      await startSession(res, await auth.changePassword(user, body));
    });
  });

  const me = memberArea('/me', (route) => {
    route.get('/', 'signedIn', {}, async ({ auth: { user } }, res) => {
      res.json(await auth.me(user));
    });
  });

  return [signing, session, me];
}
