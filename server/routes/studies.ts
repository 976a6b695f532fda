import { z } from 'zod';
import { catchmentTableSchema, studyCreateSchema } from '../../shared/schemas/studies';
import type { AppContext } from '../context';
import { requireActiveSubscription } from '../middleware/require-active-subscription';
import { sendDownload } from './download';
import { idOf, memberArea, type ApiArea } from './route-table';

const studyParams = z.object({ id: idOf('Study') });

/**
 * /api/studies: regional studies. Admins and consultants make them (they write scenarios in the
 * catchments); whoever runs scenarios follows, starts, retries and cancels them and reads the
 * regional result. Starting and retrying need an active seat plan.
 */
export function studyRoutes(ctx: AppContext): ApiArea {
  const { studies, studyResults } = ctx;
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
