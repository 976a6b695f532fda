import { Router } from 'express';
import type { AppContext } from '../context';
import { authRoutes } from './auth';
import { catchmentBandRoutes } from './catchment-bands';
import { catchmentDatasetRoutes } from './catchment-datasets';
import { catchmentRoutes } from './catchments';
import { healthRoutes } from './health';
import { memberRoutes } from './members';

/** Every /api router, in one list. */
export function apiRoutes(ctx: AppContext): Router {
  const router = Router();
  router.use(healthRoutes(ctx));
  router.use(authRoutes(ctx));
  router.use(memberRoutes(ctx));
  router.use(catchmentRoutes(ctx));
  router.use(catchmentBandRoutes(ctx));
  router.use(catchmentDatasetRoutes(ctx));
  return router;
}
