import { z } from 'zod';
import { gradientSettingsSchema, waterSettingsSchema } from '../../shared/schemas/water-settings';
import type { AppContext } from '../context';
import { sendDownload } from './download';
import { idOf, memberArea, type ApiArea } from './route-table';

const params = z.object({ catchmentId: idOf('Catchment') });

/**
 * /api/catchments/:catchmentId/water: how the catchment's water side is simulated (gradients from
 * its stations, snow redistribution, routing, the glacier of multi-decade runs), and the vertical
 * gradients fitted from its stations.
 */
export function catchmentWaterRoutes(ctx: AppContext): ApiArea {
  const { waterSettings, gradients } = ctx;
  return memberArea('/catchments/:catchmentId/water', (route) => {
    route.get('/', 'readCatchments', { params }, async ({ auth: { scope }, params }, res) => {
      res.json(await waterSettings.get(scope, params.catchmentId));
    });

    route.put('/', 'editCatchments', { params, body: waterSettingsSchema }, async ({ auth: { scope, user }, params, body }, res) => {
      res.json(await waterSettings.save(scope, user, params.catchmentId, body, (s) => gradients.check(scope, params.catchmentId, s.gradients)));
    });

    route.get('/gradients', 'readCatchments', { params }, async ({ auth: { scope }, params }, res) => {
      const settings = await waterSettings.settings(scope, params.catchmentId);
      res.json(await gradients.fit(scope, params.catchmentId, settings.gradients, settings.gradients.use));
    });

    route.get('/gradients.csv', 'readCatchments', { params }, async ({ auth: { scope }, params }, res) => {
      const settings = await waterSettings.settings(scope, params.catchmentId);
      sendDownload(res, await gradients.csvFile(scope, params.catchmentId, settings.gradients));
    });

    // Fitting is read-only: the form previews settings before they are saved.
    route.post('/gradients/preview', 'readCatchments', { params, body: gradientSettingsSchema }, async ({ auth: { scope }, params, body }, res) => {
      res.json(await gradients.fit(scope, params.catchmentId, body, false));
    });
  });
}
