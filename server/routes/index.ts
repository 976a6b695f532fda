import express, { Router } from 'express';
import type { AppContext } from '../context';
import { apiNotFound } from '../middleware/error-handler';
import { requireAuth } from '../middleware/require-auth';
import { authRoutes } from './auth';
import { billingRoutes, billingWebhookRoutes } from './billing';
import { briefingRoutes } from './briefings';
import { catchmentBandRoutes } from './catchment-bands';
import { catchmentDatasetRoutes } from './catchment-datasets';
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
import { runRoutes } from './runs';
import { scenarioRoutes } from './scenarios';

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
    catchmentStationRoutes(ctx),
    catchmentWaterRoutes(ctx),
    scenarioRoutes(ctx),
    runRoutes(ctx),
    labRoutes(ctx),
    briefingRoutes(ctx),
  ];
}

/**
 * The /api router: raw-body areas, the JSON parser, public areas, then the one sign-in check
 * (the session is verified and the user loaded once per request), then every member area,
 * each mounted once at its own prefix. Unknown paths answer 404 (401 when signed out).
 */
export function apiRouter(ctx: AppContext): Router {
  const areas = apiAreas(ctx);
  const router = Router();
  const mount = (list: ApiArea[]) => {
    for (const area of list) router.use(area.prefix, areaRouter(area));
  };
  mount(areas.filter((a) => a.rawBody));
  router.use(express.json({ limit: '1mb' }));
  mount(areas.filter((a) => a.isPublic && !a.rawBody));
  router.use(requireAuth(ctx));
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
