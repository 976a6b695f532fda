import { z } from 'zod';
import { catchmentTableSchema, studyCreateSchema } from '../../shared/schemas/studies';
import type { AppContext } from '../context';
import { outlineBatchFieldsSchema } from '../../shared/schemas/outline-batches';
import { outlineBatchUpload, uploadedByField } from '../middleware/geodata-upload';
import { requireActiveSubscription } from '../middleware/require-active-subscription';
import { requireDraftStudy } from '../middleware/require-draft-study';
import { sendDownload } from './download';
import { idOf, memberArea, type ApiArea } from './route-table';

const studyParams = z.object({ id: idOf('Study') });
const batchParams = studyParams.extend({ batchToken: z.string().regex(/^[A-Za-z0-9_-]{1,64}$/, { error: 'Pending upload' }) });

/**
 * /api/studies: regional studies. Admins and consultants make them (they write scenarios in the
 * catchments); whoever runs scenarios follows, starts, retries and cancels them and reads the
 * regional result. Starting and retrying need an active seat plan. Catchments are added in bulk
 * to a study not yet started, by whoever makes catchments: from a catchment table, or from
 * outlines over one DEM (read and derived first as a pending batch, then confirmed).
 */
export function studyRoutes(ctx: AppContext): ApiArea {
  const { studies, studyResults, outlineBatches } = ctx;
  return memberArea('/studies', (route) => {
    route.get('/', 'runScenarios', {}, async ({ auth: { scope } }, res) => {
      res.json({ studies: await studies.list(scope) });
    });

    route.post('/', 'editCatchments', { body: studyCreateSchema }, async ({ auth: { scope, user }, body }, res) => {
      res.status(201).json({ study: await studies.create(scope, body, user.id) });
    });

    route.get('/:id', 'runScenarios', { params: studyParams }, async ({ auth: { scope }, params }, res) => {
      res.json({ study: await studies.get(scope, params.id) });
    });

    route.post('/:id/catchment-table', 'editCatchments', { params: studyParams, body: catchmentTableSchema },
      async ({ auth: { scope, user }, params, body }, res) => {
        res.status(201).json(await studies.addCatchmentTable(scope, params.id, body, user.id));
      });

    // The study is checked before the files are streamed to disk, so foreign ids never get as far as reading them;
    // reading them takes one of the organisation's upload slots like any upload.
    route.post('/:id/outline-batches', 'editCatchments', { params: studyParams, before: [requireDraftStudy(), ctx.uploadSlots.hold(), outlineBatchUpload()], body: outlineBatchFieldsSchema },
      async ({ auth: { scope, user }, params, body, req }, res) => {
        res.status(202).json({ batch: await outlineBatches.read(scope, user, params.id, uploadedByField(req), body) });
      });

    route.get('/:id/outline-batches/:batchToken', 'editCatchments', { params: batchParams }, async ({ auth: { scope }, params }, res) => {
      res.json({ batch: await outlineBatches.get(scope, params.id, params.batchToken) });
    });

    route.post('/:id/outline-batches/:batchToken/confirm', 'editCatchments', { params: batchParams }, async ({ auth: { scope, user }, params }, res) => {
      res.status(201).json(await outlineBatches.confirm(scope, user, params.id, params.batchToken));
    });

    route.delete('/:id/outline-batches/:batchToken', 'editCatchments', { params: batchParams }, async ({ auth: { scope }, params }, res) => {
      await outlineBatches.discard(scope, params.id, params.batchToken);
      res.status(204).end();
    });

    route.post('/:id/start', 'runScenarios', { params: studyParams, before: [requireActiveSubscription(ctx)] },
      async ({ auth: { scope, user }, params }, res) => {
        res.status(202).json({ study: await studies.start(scope, params.id, user.id) });
      });

    route.post('/:id/retry', 'runScenarios', { params: studyParams, before: [requireActiveSubscription(ctx)] },
      async ({ auth: { scope, user }, params }, res) => {
        res.status(202).json({ study: await studies.retry(scope, params.id, user.id) });
      });

    route.post('/:id/cancel', 'runScenarios', { params: studyParams }, async ({ auth: { scope }, params }, res) => {
      res.json({ study: await studies.cancel(scope, params.id) });
    });

    route.get('/:id/results', 'runScenarios', { params: studyParams }, async ({ auth: { scope }, params }, res) => {
      res.json({ results: await studyResults.results(scope, params.id) });
    });

    route.get('/:id/export/regional.csv', 'runScenarios', { params: studyParams }, async ({ auth: { scope }, params }, res) => {
      sendDownload(res, await studyResults.csv(scope, params.id));
    });
  });
}
