import { z } from 'zod';
import { startRunSchema } from '../../shared/schemas/runs';
import type { AppContext } from '../context';
import { requireActiveSubscription } from '../middleware/require-active-subscription';
import { sendDownload } from './download';
import { idOf, memberArea, type ApiArea } from './route-table';

const catchmentParams = z.object({ catchmentId: idOf('Catchment') });
const runParams = catchmentParams.extend({ id: idOf('Run') });

/**
 * /api/catchments/:catchmentId/runs: admins, consultants and scientists start, follow and cancel
 * runs and read their results; clients nothing. Starting needs an active seat plan.
 */
export function runRoutes(ctx: AppContext): ApiArea {
  const { runs, results } = ctx;
  return memberArea('/catchments/:catchmentId/runs', (route) => {
    route.get('/', 'runScenarios', { params: catchmentParams }, async ({ auth: { scope }, params }, res) => {
      res.json({ runs: await runs.list(scope, params.catchmentId) });
    });

    route.post('/', 'runScenarios', { params: catchmentParams, before: [requireActiveSubscription(ctx)], body: startRunSchema },
      async ({ auth: { scope, user }, params, body }, res) => {
        const { run, reused } = await runs.start(scope, params.catchmentId, body, user.id);
        res.status(reused ? 200 : 202).json({ run, reused });
      });

    route.get('/:id', 'runScenarios', { params: runParams }, async ({ auth: { scope }, params }, res) => {
      res.json({ run: await runs.get(scope, params.catchmentId, params.id) });
    });

    route.post('/:id/cancel', 'runScenarios', { params: runParams }, async ({ auth: { scope }, params }, res) => {
      res.json({ run: await runs.cancel(scope, params.catchmentId, params.id) });
    });

    route.get('/:id/results', 'runScenarios', { params: runParams }, async ({ auth: { scope }, params }, res) => {
      res.json({ results: await results.results(scope, params.catchmentId, params.id) });
    });

    route.get('/:id/years', 'runScenarios', { params: runParams }, async ({ auth: { scope }, params }, res) => {
      res.json({ results: await results.transient(scope, params.catchmentId, params.id) });
    });

    route.get('/:id/export/years.csv', 'runScenarios', { params: runParams }, async ({ auth: { scope }, params }, res) => {
      sendDownload(res, await results.yearsCsv(scope, params.catchmentId, params.id));
    });

    route.get('/:id/export/bands.csv', 'runScenarios', { params: runParams }, async ({ auth: { scope }, params }, res) => {
      sendDownload(res, await results.bandMonthCsv(scope, params.catchmentId, params.id));
    });

    route.get('/:id/export/daily.csv', 'runScenarios', { params: runParams }, async ({ auth: { scope }, params }, res) => {
      sendDownload(res, await results.dailyCsv(scope, params.catchmentId, params.id));
    });
  });
}
