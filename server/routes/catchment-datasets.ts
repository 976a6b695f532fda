import { Router } from 'express';
import type { AppContext } from '../context';
import { csvUpload } from '../middleware/csv-upload';
import { authOf, requireAuth } from '../middleware/require-auth';
import { requireRole } from '../middleware/require-role';
import { idParam } from '../middleware/validate';
import { READERS, WRITERS } from './catchments';

/** /api/catchments/:id/datasets and /uploads: station series and observations, uploaded in two steps. */
export function catchmentDatasetRoutes(ctx: AppContext): Router {
  const router = Router();
  const base = '/catchments/:id';
  router.use([`${base}/datasets`, `${base}/uploads`], requireAuth(ctx), requireRole(...READERS));
  const ids = (req: Parameters<typeof idParam>[0]) => [authOf(req).scope, idParam(req), idParam(req, 'datasetId')] as const;

  router.get(`${base}/datasets`, async (req, res) => {
    res.json({ datasets: await ctx.datasets.list(authOf(req).scope, idParam(req)) });
  });

  router.get(`${base}/datasets/:datasetId/series`, async (req, res) => {
    res.json(await ctx.datasets.series(...ids(req)));
  });

  router.get(`${base}/datasets/:datasetId/monthly`, async (req, res) => {
    res.json(await ctx.datasets.monthly(...ids(req)));
  });

  router.get(`${base}/datasets/:datasetId/readings`, async (req, res) => {
    res.json({ readings: await ctx.datasets.stakeReadings(...ids(req)) });
  });

  router.get(`${base}/datasets/:datasetId/csv`, async (req, res) => {
    const { fileName, text } = await ctx.datasets.csv(...ids(req));
    res.attachment(fileName).type('text/csv').send(text);
  });

  router.delete(`${base}/datasets/:datasetId`, requireRole(...WRITERS), async (req, res) => {
    await ctx.datasets.remove(...ids(req));
    res.status(204).end();
  });

  // The catchment is checked before the file is read, so foreign ids never get as far as parsing.
  router.post(`${base}/uploads`, requireRole(...WRITERS), async (req, _res, next) => {
    await ctx.catchments.get(authOf(req).scope, idParam(req));
    next();
  }, csvUpload(), async (req, res) => {
    const { scope, user } = authOf(req);
    res.status(201).json(await ctx.uploads.preview(scope, idParam(req), req.file!, req.body, user));
  });

  router.post(`${base}/uploads/:token/confirm`, requireRole(...WRITERS), async (req, res) => {
    const { scope, user } = authOf(req);
    res.status(201).json({ dataset: await ctx.uploads.confirm(scope, idParam(req), String(req.params.token), user) });
  });

  router.delete(`${base}/uploads/:token`, requireRole(...WRITERS), async (req, res) => {
    await ctx.uploads.discard(authOf(req).scope, idParam(req), String(req.params.token));
    res.status(204).end();
  });

  return router;
}
