import { Router } from 'express';
import type { AppContext } from '../context';
import { authRoutes } from './auth';
import { billingRoutes } from './billing';
import { briefingRoutes } from './briefings';
import { catchmentBandRoutes } from './catchment-bands';
import { catchmentDatasetRoutes } from './catchment-datasets';
import { catchmentRoutes } from './catchments';
import { devInboxRoutes } from './dev-inbox';
import { healthRoutes } from './health';
import { invitationRoutes } from './invitations';
import { labRoutes } from './lab';
import { memberRoutes } from './members';
import { passwordResetRoutes } from './password-reset';
import { runRoutes } from './runs';
import { scenarioRoutes } from './scenarios';

/** Every /api router, in one list. */
export function apiRoutes(ctx: AppContext): Router {
  const router = Router();
  router.use(healthRoutes(ctx));
  router.use(authRoutes(ctx));
  router.use(memberRoutes(ctx));
  router.use(billingRoutes(ctx));
  router.use(invitationRoutes(ctx));
  router.use(passwordResetRoutes(ctx));
  router.use(devInboxRoutes(ctx));
  router.use(catchmentRoutes(ctx));
  router.use(catchmentBandRoutes(ctx));
  router.use(catchmentDatasetRoutes(ctx));
  router.use(labRoutes(ctx));
  router.use(scenarioRoutes(ctx));
  router.use(runRoutes(ctx));
  router.use(briefingRoutes(ctx));
  return router;
}
