import { z } from 'zod';
import { stationComparisonQuerySchema, stationFormSchema } from '../../shared/schemas/stations';
import type { AppContext } from '../context';
import { idOf, memberArea, type ApiArea } from './route-table';

const catchmentParams = z.object({ catchmentId: idOf('Catchment') });
const stationParams = catchmentParams.extend({ stationId: idOf('Station') });

/** /api/catchments/:catchmentId/stations: the catchment's stations and comparisons of their records. */
export function catchmentStationRoutes(ctx: AppContext): ApiArea {
  const { stations, stationComparison } = ctx;
  return memberArea('/catchments/:catchmentId/stations', (route) => {
    route.get('/', 'readCatchments', { params: catchmentParams }, async ({ auth: { scope }, params }, res) => {
      res.json({ stations: await stations.list(scope, params.catchmentId) });
    });

    route.get('/compare', 'readCatchments', { params: catchmentParams, query: stationComparisonQuerySchema }, async ({ auth: { scope }, params, query }, res) => {
      res.json(await stationComparison.compare(scope, params.catchmentId, query.first, query.second));
    });

    route.post('/', 'editCatchments', { params: catchmentParams, body: stationFormSchema }, async ({ auth: { scope }, params, body }, res) => {
      res.status(201).json({ station: await stations.create(scope, params.catchmentId, body) });
    });

    route.put('/:stationId', 'editCatchments', { params: stationParams, body: stationFormSchema }, async ({ auth: { scope }, params, body }, res) => {
      res.json({ station: await stations.update(scope, params.catchmentId, params.stationId, body) });
    });

    route.delete('/:stationId', 'editCatchments', { params: stationParams }, async ({ auth: { scope }, params }, res) => {
      await stations.remove(scope, params.catchmentId, params.stationId);
      res.status(204).end();
    });
  });
}
