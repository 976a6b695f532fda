import { z } from 'zod';
import { catchmentArchiveSchema, catchmentFormSchema, catchmentListQuerySchema } from '../../shared/schemas/catchments';
import type { AppContext } from '../context';
import { idOf, memberArea, type ApiArea } from './route-table';

const catchmentParams = z.object({ id: idOf('Catchment') });

/** /api/catchments: list, read, create, edit, archive, delete. */
export function catchmentRoutes(ctx: AppContext): ApiArea {
  const service = ctx.catchments;
  return memberArea('/catchments', (route) => {
    route.get('/', 'readCatchments', { query: catchmentListQuerySchema }, async ({ auth: { scope }, query }, res) => {
      res.json(await service.list(scope, query));
    });

    route.post('/', 'editCatchments', { body: catchmentFormSchema }, async ({ auth: { scope, user }, body }, res) => {
      res.status(201).json({ catchment: await service.create(scope, body, user.id) });
    });

    route.get('/:id', 'readCatchments', { params: catchmentParams }, async ({ auth: { scope }, params }, res) => {
      res.json({ catchment: await service.get(scope, params.id) });
    });

    route.put('/:id', 'editCatchments', { params: catchmentParams, body: catchmentFormSchema }, async ({ auth: { scope }, params, body }, res) => {
      res.json({ catchment: await service.update(scope, params.id, body) });
    });

    route.post('/:id/archive', 'editCatchments', { params: catchmentParams, body: catchmentArchiveSchema }, async ({ auth: { scope }, params, body }, res) => {
      res.json({ catchment: await service.setArchived(scope, params.id, body.archived) });
    });

    route.delete('/:id', 'editCatchments', { params: catchmentParams }, async ({ auth: { scope }, params }, res) => {
      res.json({ outcome: await service.remove(scope, params.id) });
    });
  });
}
