import { Router } from 'express';
import { z } from 'zod';
import { periodSchema, scenarioCreateSchema, scenarioUpdateSchema, type ScenarioSetup } from '../../shared/schemas/scenarios';
import { defaultSeason } from '../../shared/analysis/default-season';
import { daysBetween } from '../../shared/melt/calendar';
import { climateRecord } from '../services/runs/climate-record';
import type { AppContext } from '../context';
import { authOf, requireAuth } from '../middleware/require-auth';
import { requireRole } from '../middleware/require-role';
import { idParam, parseWith, validateBody } from '../middleware/validate';
import { READERS, WRITERS } from './catchments';

const listQuery = z.object({ archived: z.enum(['true', 'false']).default('false').transform((v) => v === 'true') });
/** The preview simulates one band in the browser; a year at most keeps the download small. */
const previewQuery = periodSchema.refine((p) => daysBetween(p.from, p.to) <= 366, { path: ['to'], message: 'the preview covers at most one year' });

/** /api/catchments/:catchmentId/scenarios: consultants and admins write, scientists read, clients nothing. */
export function scenarioRoutes(ctx: AppContext): Router {
  const router = Router();
  const service = ctx.scenarios;
  const base = '/catchments/:catchmentId/scenarios';
  router.use(base, requireAuth(ctx), requireRole(...READERS));

  router.use('/catchments/:catchmentId/scenario-setup', requireAuth(ctx), requireRole(...READERS));
  router.use('/catchments/:catchmentId/preview-input', requireAuth(ctx), requireRole(...READERS));

  router.get('/catchments/:catchmentId/scenario-setup', async (req, res) => {
    const { scope } = authOf(req);
    const catchment = await scope.findOr404<{ latitude_deg: number }>('catchments', idParam(req, 'catchmentId'), 'Catchment');
    const record = await climateRecord(scope, idParam(req, 'catchmentId'));
    const saved = await ctx.lab.calibrations.current(scope, idParam(req, 'catchmentId'));
    const calibration = saved
      ? { parameters: saved.set.parameters, precipitationFactor: saved.set.precipitationFactor, savedBy: saved.savedBy, savedAt: saved.savedAt }
      : null;
    const reply: ScenarioSetup = { record, defaultPeriod: record ? defaultSeason(record, catchment.latitude_deg) : null, calibration };
    res.json(reply);
  });

  router.get('/catchments/:catchmentId/preview-input', async (req, res) => {
    const period = parseWith(previewQuery, req.query);
    res.json(await ctx.runs.previewInputs(authOf(req).scope, idParam(req, 'catchmentId'), period));
  });

  router.get(base, async (req, res) => {
    const { archived } = parseWith(listQuery, req.query);
    res.json({ scenarios: await service.list(authOf(req).scope, idParam(req, 'catchmentId'), archived) });
  });

  router.post(base, requireRole(...WRITERS), validateBody(scenarioCreateSchema), async (req, res) => {
    const { scope, user } = authOf(req);
    res.status(201).json({ scenario: await service.create(scope, idParam(req, 'catchmentId'), req.body, user.id) });
  });

  router.get(`${base}/:id`, async (req, res) => {
    res.json({ scenario: await service.get(authOf(req).scope, idParam(req, 'catchmentId'), idParam(req)) });
  });

  router.patch(`${base}/:id`, requireRole(...WRITERS), validateBody(scenarioUpdateSchema), async (req, res) => {
    res.json({ scenario: await service.update(authOf(req).scope, idParam(req, 'catchmentId'), idParam(req), req.body) });
  });

  router.post(`${base}/:id/duplicate`, requireRole(...WRITERS), async (req, res) => {
    const { scope, user } = authOf(req);
    res.status(201).json({ scenario: await service.duplicate(scope, idParam(req, 'catchmentId'), idParam(req), user.id) });
  });

  return router;
}
