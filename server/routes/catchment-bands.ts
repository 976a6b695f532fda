import { Router } from 'express';
import type { AppContext } from '../context';
import { csvUpload } from '../middleware/csv-upload';
import { authOf, requireAuth } from '../middleware/require-auth';
import { requireRole } from '../middleware/require-role';
import { idParam } from '../middleware/validate';
import { readBandFile } from '../services/catchments/csv/band-file';
import { safeFileName } from '../../shared/csv/csv-writing';
import { decodeCsvText } from '../services/catchments/csv/read-table';
import { READERS, WRITERS } from './catchments';

/** /api/catchments/:id/bands: the band table, as JSON or CSV; a CSV read into rows for the editor. */
export function catchmentBandRoutes(ctx: AppContext): Router {
  const router = Router();
  const path = '/catchments/:id/bands';
  router.use(path, requireAuth(ctx), requireRole(...READERS));

  router.get(path, async (req, res) => {
    res.json({ bands: await ctx.bands.list(authOf(req).scope, idParam(req)) });
  });

  router.put(path, requireRole(...WRITERS), async (req, res) => {
    res.json({ bands: await ctx.bands.replace(authOf(req).scope, idParam(req), req.body?.bands) });
  });

  router.get(`${path}.csv`, requireAuth(ctx), requireRole(...READERS), async (req, res) => {
    const { scope } = authOf(req);
    const catchment = await ctx.catchments.get(scope, idParam(req));
    const text = await ctx.bands.csv(scope, catchment.id);
    res.attachment(`${safeFileName(catchment.name)}-bands.csv`).type('text/csv').send(text);
  });

  // Reads a band file into rows and problems without storing it: the editor shows them, then saves.
  router.post(`${path}/file`, requireRole(...WRITERS), async (req, _res, next) => {
    await ctx.catchments.get(authOf(req).scope, idParam(req));
    next();
  }, csvUpload(), async (req, res) => {
    res.json(readBandFile(decodeCsvText(req.file!.buffer)));
  });

  return router;
}
