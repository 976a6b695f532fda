import { Router } from 'express';
import type { AppContext } from '../context';
import { authRoutes } from './auth';
import { healthRoutes } from './health';
import { memberRoutes } from './members';

/** Every /api router, in one list. */
export function apiRoutes(ctx: AppContext): Router {
  const router = Router();
  router.use(healthRoutes(ctx));
  router.use(authRoutes(ctx));
  router.use(memberRoutes(ctx));
  return router;
}
