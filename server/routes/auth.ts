import { Router, type CookieOptions, type Response } from 'express';
import { signInSchema, signUpSchema } from '../../shared/schemas/auth';
import type { AppContext } from '../context';
import { authOf, requireAuth, SESSION_COOKIE } from '../middleware/require-auth';
import { signInLimits } from '../middleware/sign-in-limits';
import { validateBody } from '../middleware/validate';
import type { UserRow } from '../services/auth/auth-service';
import { signSessionToken } from '../services/auth/session-tokens';

/** /api/auth/* and /api/me: sign-up, sign-in, sign-out and the current user. */
export function authRoutes(ctx: AppContext): Router {
  const router = Router();
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

  router.post('/auth/sign-up', validateBody(signUpSchema), async (req, res) => {
    const user = await auth.signUp(req.body);
    res.status(201);
    await startSession(res, user);
  });

  router.post('/auth/sign-in', ...signInLimits(config.auth.signInLimits), validateBody(signInSchema), async (req, res) => {
    await startSession(res, await auth.signIn(req.body));
  });

  router.post('/auth/sign-out', requireAuth(ctx), async (req, res) => {
    await auth.signOut(authOf(req).user.id);
    const { maxAge: _unused, ...clear } = cookieOptions();
    res.clearCookie(SESSION_COOKIE, clear);
    res.status(204).end();
  });

  router.get('/me', requireAuth(ctx), async (req, res) => {
    res.json(await auth.me(authOf(req).user));
  });

  return router;
}
