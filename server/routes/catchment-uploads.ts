import { z } from 'zod';
import { datasetUploadFieldsSchema } from '../../shared/schemas/datasets';
import type { AppContext } from '../context';
import { csvUpload } from '../middleware/csv-upload';
import { requireCatchment } from '../middleware/require-catchment';
import { idOf, memberArea, type ApiArea } from './route-table';

const catchmentParams = z.object({ catchmentId: idOf('Catchment') });
const pendingParams = catchmentParams.extend({ token: z.string().regex(/^[A-Za-z0-9_-]{1,64}$/, { error: 'Pending upload' }) });

/** /api/catchments/:catchmentId/uploads: a CSV file previewed first, then stored or discarded. */
export function catchmentUploadRoutes(ctx: AppContext): ApiArea {
  const { uploads } = ctx;
  return memberArea('/catchments/:catchmentId/uploads', (route) => {
    // The catchment is checked before the file is read, so foreign ids never get as far as parsing.
    route.post('/', 'editCatchments', { params: catchmentParams, before: [requireCatchment(ctx), ctx.uploadSlots.hold(), csvUpload()], body: datasetUploadFieldsSchema },
      async ({ auth: { scope, user }, params, body, req }, res) => {
        res.status(201).json(await uploads.preview(scope, params.catchmentId, req.file!, body, user));
      });

    route.post('/:token/confirm', 'editCatchments', { params: pendingParams }, async ({ auth: { scope, user }, params }, res) => {
      res.status(201).json({ dataset: await uploads.confirm(scope, params.catchmentId, params.token, user) });
    });

    route.delete('/:token', 'editCatchments', { params: pendingParams }, async ({ auth: { scope }, params }, res) => {
      await uploads.discard(scope, params.catchmentId, params.token);
      res.status(204).end();
    });
  });
}
