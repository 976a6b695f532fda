import { z } from 'zod';
import { bandTableRefusal, bandTableRequestSchema } from '../../shared/schemas/catchment-bands';
import type { AppContext } from '../context';
import { validationFailed } from '../errors';
import { csvUpload } from '../middleware/csv-upload';
import { requireCatchment } from '../middleware/require-catchment';
import { sendDownload } from './download';
import { idOf, memberArea, type ApiArea } from './route-table';

const params = z.object({ catchmentId: idOf('Catchment') });

/** /api/catchments/:catchmentId/bands: the band table, as JSON or CSV; a CSV read into rows for the editor. */
export function catchmentBandRoutes(ctx: AppContext): ApiArea {
  const refuse = (issues: Parameters<typeof bandTableRefusal>[0]) => {
    const { message, field, problems } = bandTableRefusal(issues);
    return validationFailed(message, field, { problems });
  };
  return memberArea('/catchments/:catchmentId', (route) => {
    route.get('/bands', 'readCatchments', { params }, async ({ auth: { scope }, params }, res) => {
      res.json({ bands: await ctx.bands.list(scope, params.catchmentId) });
    });

    route.put('/bands', 'editCatchments', { params, body: bandTableRequestSchema, refuse }, async ({ auth: { scope, user }, params, body }, res) => {
      res.json({ bands: await ctx.bands.replace(scope, params.catchmentId, body.bands, { source: 'entered' }, user.id) });
    });

    route.get('/bands/versions', 'readCatchments', { params }, async ({ auth: { scope }, params }, res) => {
      res.json({ versions: await ctx.bands.versions(scope, params.catchmentId) });
    });

    route.get('/bands.csv', 'readCatchments', { params }, async ({ auth: { scope }, params }, res) => {
      sendDownload(res, await ctx.bands.csvFile(scope, params.catchmentId));
    });

    route.post('/bands/file', 'editCatchments', { params, before: [requireCatchment(ctx), ctx.uploadSlots.hold(), csvUpload()] }, ({ req }, res) => {
      res.json(ctx.bands.readFile(req.file!));
    });
  });
}
