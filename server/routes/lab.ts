import { Router } from 'express';
import type { AppContext } from '../context';
import { bandQuerySchema } from '../../shared/schemas/lab';
import { authOf, requireAuth } from '../middleware/require-auth';
import { requireRole } from '../middleware/require-role';
import { requireActiveSubscription } from '../middleware/require-active-subscription';
import { idParam, parseWith } from '../middleware/validate';

/** Who reaches the lab (DESIGN.md: scientists, and the consultants and admins who run the work). */
const LAB_ROLES = ['admin', 'consultant', 'scientist'] as const;

/** /api/lab: surface response, reference models, skill, calibration and sweeps per catchment. */
export function labRoutes(ctx: AppContext): Router {
  const router = Router();
  const base = '/lab/catchments/:id';
  router.use('/lab', requireAuth(ctx), requireRole(...LAB_ROLES));

  router.get(`${base}/surface-response`, async (req, res) => {
    res.json(await ctx.lab.surfaceResponse(authOf(req).scope, idParam(req), parseWith(bandQuerySchema, req.query)));
  });

  router.get(`${base}/reference-models`, async (req, res) => {
    res.json(await ctx.lab.referenceModels(authOf(req).scope, idParam(req), parseWith(bandQuerySchema, req.query)));
  });

  router.post(`${base}/skill`, async (req, res) => {
    res.json(await ctx.lab.skill(authOf(req).scope, idParam(req), req.body));
  });

  router.post(`${base}/stake-skill`, async (req, res) => {
    res.json(await ctx.lab.stakeSkill(authOf(req).scope, idParam(req), req.body));
  });

  router.get(`${base}/calibration`, async (req, res) => {
    const { scope } = authOf(req);
    await scope.findOr404('catchments', idParam(req), 'Catchment');
    const history = await ctx.lab.calibrations.history(scope, idParam(req));
    res.json({ current: history[0] ?? null, history });
  });

  router.put(`${base}/calibration`, async (req, res) => {
    const { scope, user } = authOf(req);
    await scope.findOr404('catchments', idParam(req), 'Catchment');
    res.status(201).json(await ctx.lab.saveCalibration(scope, user, idParam(req), req.body));
  });

  // Sweeps and automatic calibrations are paid work, like runs; reading and scoring stay open.
  router.post(`${base}/sweeps`, requireActiveSubscription(ctx), async (req, res) => {
    const { scope, user } = authOf(req);
    res.status(202).json(await ctx.lab.startSweep(scope, user, idParam(req), req.body));
  });

  router.post(`${base}/calibrations`, requireActiveSubscription(ctx), async (req, res) => {
    const { scope, user } = authOf(req);
    res.status(202).json(await ctx.lab.startCalibration(scope, user, idParam(req), req.body));
  });

  router.get(`${base}/jobs`, async (req, res) => {
    const { scope } = authOf(req);
    await scope.findOr404('catchments', idParam(req), 'Catchment');
    res.json({ jobs: await ctx.lab.jobs.list(scope, idParam(req)) });
  });

  router.get('/lab/jobs/:jobId', async (req, res) => {
    res.json(await ctx.lab.jobs.get(authOf(req).scope, idParam(req, 'jobId')));
  });

  router.post('/lab/jobs/:jobId/cancel', async (req, res) => {
    res.json(await ctx.lab.jobs.cancel(authOf(req).scope, idParam(req, 'jobId')));
  });

  return router;
}
