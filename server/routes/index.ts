import express, { Router } from 'express';
import type { AppContext } from '../context';
import { apiNotFound } from '../middleware/error-handler';
import { idempotencyKeys } from '../middleware/idempotency-keys';
import { requireAuth } from '../middleware/require-auth';
import { sameOriginWrites } from '../middleware/same-origin-writes';
import { authRoutes } from './auth';
import { billingRoutes, billingWebhookRoutes } from './billing';
import { briefingRoutes } from './briefings';
import { catchmentBandRoutes } from './catchment-bands';
import { catchmentDatasetRoutes } from './catchment-datasets';
import { catchmentGeodataRoutes } from './catchment-geodata';
import { catchmentUploadRoutes } from './catchment-uploads';
import { catchmentRoutes } from './catchments';
import { catchmentStationRoutes } from './catchment-stations';
import { catchmentWaterRoutes } from './catchment-water';
import { devInboxRoutes } from './dev-inbox';
import { healthRoutes } from './health';
import { invitationRoutes } from './invitations';
import { labRoutes } from './lab';
import { memberRoutes } from './members';
import { passwordResetRoutes } from './password-reset';
import { areaRouter, fullPath, type ApiArea, type Method, type RouteAccess } from './route-table';
import { queueRoutes } from './queue';
import { runRoutes } from './runs';
import { scenarioRoutes } from './scenarios';
import { studyRoutes } from './studies';

/** Every /api area, in mounting order. */
export function apiAreas(ctx: AppContext): ApiArea[] {
  return [
    billingWebhookRoutes(ctx),
    healthRoutes(ctx),
    ...authRoutes(ctx),
    passwordResetRoutes(ctx),
    ...invitationRoutes(ctx),
    devInboxRoutes(ctx),
    memberRoutes(ctx),
    billingRoutes(ctx),
    catchmentRoutes(ctx),
    catchmentBandRoutes(ctx),
    catchmentDatasetRoutes(ctx),
    catchmentUploadRoutes(ctx),
    catchmentGeodataRoutes(ctx),
    catchmentStationRoutes(ctx),
    catchmentWaterRoutes(ctx),
    scenarioRoutes(ctx),
    runRoutes(ctx),
    labRoutes(ctx),
    studyRoutes(ctx),
    briefingRoutes(ctx),
    queueRoutes(ctx),
  ];
}

/**
 * The /api router: nothing cached, writes from other sites refused, raw-body areas, the JSON parser, public areas, then the one sign-in check
 * (the session is verified and the user loaded once per request), idempotency keys on writes, then every member area,
 * each mounted once at its own prefix. Unknown paths answer 404 (401 when signed out).
 */
export function apiRouter(ctx: AppContext): Router {
  const areas = apiAreas(ctx);
  const router = Router();
  // Answers hold tenant data or session state: never kept by a browser or a shared cache.
  router.use((_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  router.use(sameOriginWrites(ctx.config.publicUrl));
  const mount = (list: ApiArea[]) => {
    for (const area of list) router.use(area.prefix, areaRouter(area));
  };
  mount(areas.filter((a) => a.rawBody));
  router.use(express.json({ limit: '1mb' }));
  mount(areas.filter((a) => a.isPublic && !a.rawBody));
  router.use(requireAuth(ctx));
  router.use(idempotencyKeys(ctx.db, ctx.logger));
  mount(areas.filter((a) => !a.isPublic));
  router.use(apiNotFound);
  return router;
}

export interface RouteListing {
  method: Method;
  /** Full path, e.g. '/api/catchments/:catchmentId/runs/:id'. */
  path: string;
  access: RouteAccess;
}

/** Every API route with who may call it, in mounting order: what the route × role tests walk through. */
export function routeTable(ctx: AppContext): RouteListing[] {
  return apiAreas(ctx).flatMap((area) => area.routes.map((route) => ({ method: route.method, path: fullPath(area, route), access: route.access })));
}
