import { Router, type Response } from 'express';
import { startRunSchema } from '../../shared/schemas/runs';
import type { AppContext } from '../context';
import { authOf, requireAuth } from '../middleware/require-auth';
import { requireRole } from '../middleware/require-role';
import { idParam, validateBody } from '../middleware/validate';
import { READERS } from './catchments';

function sendCsv(res: Response, name: string, body: string): void {
  res.set('Content-Type', 'text/csv; charset=utf-8');
  res.set('Content-Disposition', `attachment; filename="${name}"`);
  // A byte-order mark so spreadsheet programs read the units (°, ³, ²) as UTF-8.
  res.send(`\uFEFF${body}`);
}

/**
 * /api/catchments/:catchmentId/runs: admins, consultants and scientists start, follow and cancel
 * runs and read their results; clients nothing. Starting needs an active seat plan.
 */
export function runRoutes(ctx: AppContext): Router {
  const router = Router();
  const base = '/catchments/:catchmentId/runs';
  router.use(base, requireAuth(ctx), requireRole(...READERS));
  const catchmentOf = (req: Parameters<typeof idParam>[0]) => idParam(req, 'catchmentId');

  router.get(base, async (req, res) => {
    res.json({ runs: await ctx.runs.list(authOf(req).scope, catchmentOf(req)) });
  });

  router.post(base, validateBody(startRunSchema), async (req, res) => {
    const { scope, user } = authOf(req);
    await scope.findOr404('catchments', catchmentOf(req), 'Catchment');
    await ctx.billing.assertCanUsePaidFeatures(scope);
    const { run, reused } = await ctx.runs.start(scope, catchmentOf(req), req.body, user.id);
    res.status(reused ? 200 : 202).json({ run, reused });
  });

  router.get(`${base}/:id`, async (req, res) => {
    res.json({ run: await ctx.runs.get(authOf(req).scope, catchmentOf(req), idParam(req)) });
  });

  router.post(`${base}/:id/cancel`, async (req, res) => {
    res.json({ run: await ctx.runs.cancel(authOf(req).scope, catchmentOf(req), idParam(req)) });
  });

  router.get(`${base}/:id/results`, async (req, res) => {
    res.json({ results: await ctx.results.results(authOf(req).scope, catchmentOf(req), idParam(req)) });
  });

  router.get(`${base}/:id/export/bands.csv`, async (req, res) => {
    const csv = await ctx.results.bandMonthCsv(authOf(req).scope, catchmentOf(req), idParam(req));
    sendCsv(res, `run-${idParam(req)}-bands-by-month.csv`, csv);
  });

  router.get(`${base}/:id/export/daily.csv`, async (req, res) => {
    const csv = await ctx.results.dailyCsv(authOf(req).scope, catchmentOf(req), idParam(req));
    sendCsv(res, `run-${idParam(req)}-daily.csv`, csv);
  });

  return router;
}
