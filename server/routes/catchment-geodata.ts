import { z } from 'zod';
import { deriveRequestSchema, GEODATA_LAYERS, geodataUploadFieldsSchema } from '../../shared/schemas/geodata';
import type { AppContext } from '../context';
import { geodataUpload, uploadedFiles } from '../middleware/geodata-upload';
import { requireCatchment } from '../middleware/require-catchment';
import { idOf, memberArea, type ApiArea } from './route-table';

const params = z.object({ catchmentId: idOf('Catchment') });
const layerParams = params.extend({ layer: z.enum(GEODATA_LAYERS, { error: 'Geodata layer' }) });
const uploadParams = params.extend({ uploadId: idOf('Upload') });
const derivationParams = params.extend({ derivationId: idOf('Derivation') });
const mapQuery = z.object({ derivation: idOf('Derivation').optional(), run: idOf('Run').optional() });

/**
 * /api/catchments/:catchmentId/geodata: DEM, outline and remote-sensing uploads; bands derived
 * from them, previewed and applied; the map; snow-cover and elevation-change observations.
 */
export function catchmentGeodataRoutes(ctx: AppContext): ApiArea {
  const { uploads, derivations, maps, observations } = ctx.geodata;
  return memberArea('/catchments/:catchmentId/geodata', (route) => {
    route.get('/uploads', 'readCatchments', { params }, async ({ auth: { scope }, params }, res) => {
      res.json(await uploads.list(scope, params.catchmentId));
    });

    // The catchment is checked before the file is streamed to disk, so foreign ids never get as far as reading it;
    // a geodata upload takes one of the organisation's upload slots like a CSV upload.
    route.post('/uploads/:layer', 'editCatchments', { params: layerParams, before: [requireCatchment(ctx), ctx.uploadSlots.hold(), geodataUpload()], body: geodataUploadFieldsSchema },
      async ({ auth: { scope, user }, params, body, req }, res) => {
        res.status(201).json({ upload: await uploads.add(scope, user, params.catchmentId, params.layer, uploadedFiles(req), body) });
      });

    route.delete('/uploads/:uploadId', 'editCatchments', { params: uploadParams }, async ({ auth: { scope }, params }, res) => {
      await uploads.remove(scope, params.catchmentId, params.uploadId);
      res.status(204).end();
    });

    route.post('/derivations', 'editCatchments', { params, body: deriveRequestSchema }, async ({ auth: { scope, user }, params, body }, res) => {
      res.status(201).json({ derivation: await derivations.derive(scope, user, params.catchmentId, body) });
    });

    route.get('/derivations', 'readCatchments', { params }, async ({ auth: { scope }, params }, res) => {
      res.json({ derivations: await derivations.list(scope, params.catchmentId) });
    });

    route.get('/derivations/:derivationId', 'readCatchments', { params: derivationParams }, async ({ auth: { scope }, params }, res) => {
      res.json({ derivation: await derivations.get(scope, params.catchmentId, params.derivationId) });
    });

    route.post('/derivations/:derivationId/apply', 'editCatchments', { params: derivationParams }, async ({ auth: { scope, user }, params }, res) => {
      res.json({ derivation: await derivations.apply(scope, user, params.catchmentId, params.derivationId) });
    });

    route.get('/derivations/:derivationId/hillshade.png', 'readCatchments', { params: derivationParams }, async ({ auth: { scope }, params }, res) => {
      res.type('png').send(await derivations.hillshade(scope, params.catchmentId, params.derivationId));
    });

    route.get('/map', 'readCatchments', { params, query: mapQuery }, async ({ auth: { scope }, params, query }, res) => {
      res.json(await maps.map(scope, params.catchmentId, query));
    });

    route.get('/observations', 'readCatchments', { params }, async ({ auth: { scope }, params }, res) => {
      res.json(await observations.list(scope, params.catchmentId));
    });
  });
}
