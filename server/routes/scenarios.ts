import { z } from 'zod';
import { previewPeriodSchema, scenarioCreateSchema, scenarioListQuerySchema, scenarioUpdateSchema } from '../../shared/schemas/scenarios';
import type { AppContext } from '../context';
import { idOf, memberArea, type ApiArea } from './route-table';

const catchmentParams = z.object({ catchmentId: idOf('Catchment') });
const scenarioParams = catchmentParams.extend({ id: idOf('Scenario') });

/**
 * /api/catchments/:catchmentId/scenarios, …/scenario-setup and …/preview-input: consultants and
 * admins write, scientists read, clients nothing.
 */
export function scenarioRoutes(ctx: AppContext): ApiArea {
  const service = ctx.scenarios;
  return memberArea('/catchments/:catchmentId', (route) => {
    route.get('/scenario-setup', 'readCatchments', { params: catchmentParams }, async ({ auth: { scope }, params }, res) => {
      res.json(await service.setup(scope, params.catchmentId));
    });

    route.get('/preview-input', 'readCatchments', { params: catchmentParams, query: previewPeriodSchema }, async ({ auth: { scope }, params, query }, res) => {
      res.json(await ctx.runs.previewInputs(scope, params.catchmentId, query));
    });

    route.get('/scenarios', 'readCatchments', { params: catchmentParams, query: scenarioListQuerySchema }, async ({ auth: { scope }, params, query }, res) => {
      res.json({ scenarios: await service.list(scope, params.catchmentId, query.archived) });
    });

    route.post('/scenarios', 'editCatchments', { params: catchmentParams, body: scenarioCreateSchema }, async ({ auth: { scope, user }, params, body }, res) => {
      res.status(201).json({ scenario: await service.create(scope, params.catchmentId, body, user.id) });
    });

    route.get('/scenarios/:id', 'readCatchments', { params: scenarioParams }, async ({ auth: { scope }, params }, res) => {
      res.json({ scenario: await service.get(scope, params.catchmentId, params.id) });
    });

    route.patch('/scenarios/:id', 'editCatchments', { params: scenarioParams, body: scenarioUpdateSchema }, async ({ auth: { scope }, params, body }, res) => {
      res.json({ scenario: await service.update(scope, params.catchmentId, params.id, body) });
    });

    route.post('/scenarios/:id/duplicate', 'editCatchments', { params: scenarioParams }, async ({ auth: { scope, user }, params }, res) => {
      res.status(201).json({ scenario: await service.duplicate(scope, params.catchmentId, params.id, user.id) });
    });
  });
}
