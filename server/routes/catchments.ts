import { Router } from 'express';
import { catchmentFormSchema, catchmentListQuerySchema } from '../../shared/schemas/catchments';
import type { AppContext } from '../context';
import { authOf, requireAuth } from '../middleware/require-auth';
import { requireRole } from '../middleware/require-role';
import { idParam, parseWith, validateBody } from '../middleware/validate';
import { z } from 'zod';

/** Everyone with workshop access reads catchments; clients have none. */
export const READERS = ['admin', 'consultant', 'scientist'] as const;
export const WRITERS = ['admin', 'consultant'] as const;

/** /api/catchments: list, read, create, edit, archive, delete. */
export function catchmentRoutes(ctx: AppContext): Router {
  const router = Router();
  const service = ctx.catchments;
  router.use('/catchments', requireAuth(ctx), requireRole(...READERS));

  router.get('/catchments', async (req, res) => {
    const query = parseWith(catchmentListQuerySchema, req.query);
    res.json(await service.list(authOf(req).scope, query));
  });

  router.post('/catchments', requireRole(...WRITERS), validateBody(catchmentFormSchema), async (req, res) => {
    const { scope, user } = authOf(req);
    res.status(201).json({ catchment: await service.create(scope, req.body, user.id) });
  });

  router.get('/catchments/:id', async (req, res) => {
    res.json({ catchment: await service.get(authOf(req).scope, idParam(req)) });
  });

  router.put('/catchments/:id', requireRole(...WRITERS), validateBody(catchmentFormSchema), async (req, res) => {
    res.json({ catchment: await service.update(authOf(req).scope, idParam(req), req.body) });
  });

  router.post('/catchments/:id/archive', requireRole(...WRITERS), validateBody(z.object({ archived: z.boolean() })), async (req, res) => {
    res.json({ catchment: await service.setArchived(authOf(req).scope, idParam(req), req.body.archived) });
  });

  router.delete('/catchments/:id', requireRole(...WRITERS), async (req, res) => {
    res.json({ outcome: await service.remove(authOf(req).scope, idParam(req)) });
  });

  return router;
}
