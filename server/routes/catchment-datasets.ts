import { z } from 'zod';
import { datasetStationSchema } from '../../shared/schemas/stations';
import type { AppContext } from '../context';
import { sendDownload } from './download';
import { idOf, memberArea, type ApiArea } from './route-table';

const catchmentParams = z.object({ catchmentId: idOf('Catchment') });
const datasetParams = catchmentParams.extend({ datasetId: idOf('Dataset') });

/** /api/catchments/:catchmentId/datasets: stored station series and observations. */
export function catchmentDatasetRoutes(ctx: AppContext): ApiArea {
  const { datasets } = ctx;
  return memberArea('/catchments/:catchmentId/datasets', (route) => {
    route.get('/', 'readCatchments', { params: catchmentParams }, async ({ auth: { scope }, params }, res) => {
      res.json({ datasets: await datasets.list(scope, params.catchmentId) });
    });

    route.get('/:datasetId/series', 'readCatchments', { params: datasetParams }, async ({ auth: { scope }, params }, res) => {
      res.json(await datasets.series(scope, params.catchmentId, params.datasetId));
    });

    route.get('/:datasetId/monthly', 'readCatchments', { params: datasetParams }, async ({ auth: { scope }, params }, res) => {
      res.json(await datasets.monthly(scope, params.catchmentId, params.datasetId));
    });

    route.get('/:datasetId/readings', 'readCatchments', { params: datasetParams }, async ({ auth: { scope }, params }, res) => {
      res.json({ readings: await datasets.stakeReadings(scope, params.catchmentId, params.datasetId) });
    });

    route.get('/:datasetId/csv', 'readCatchments', { params: datasetParams }, async ({ auth: { scope }, params }, res) => {
      sendDownload(res, await datasets.csvFile(scope, params.catchmentId, params.datasetId));
    });

    route.put('/:datasetId/station', 'editCatchments', { params: datasetParams, body: datasetStationSchema }, async ({ auth: { scope }, params, body }, res) => {
      res.json({ dataset: await datasets.assignStation(scope, params.catchmentId, params.datasetId, body.stationId) });
    });

    route.delete('/:datasetId', 'editCatchments', { params: datasetParams }, async ({ auth: { scope }, params }, res) => {
      await datasets.remove(scope, params.catchmentId, params.datasetId);
      res.status(204).end();
    });
  });
}
