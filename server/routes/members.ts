import { Router } from 'express';
import { roleChangeSchema } from '../../shared/schemas/members';
import type { AppContext } from '../context';
import { authOf, requireAuth } from '../middleware/require-auth';
import { requireRole } from '../middleware/require-role';
import { idParam, validateBody } from '../middleware/validate';

/** /api/members: the organisation's people and its seats, for its admins. */
export function memberRoutes(ctx: AppContext): Router {
  const router = Router();
  const { members } = ctx;
  router.use('/members', requireAuth(ctx), requireRole('admin'));

  router.get('/members', async (req, res) => {
    res.json(await members.list(authOf(req).scope));
  });

  router.get('/members/:id', async (req, res) => {
    res.json({ member: await members.get(authOf(req).scope, idParam(req)) });
  });

  router.patch('/members/:id', validateBody(roleChangeSchema), async (req, res) => {
    const { user, scope } = authOf(req);
    res.json({ member: await members.changeRole(scope, user, idParam(req), req.body.role) });
  });

  router.delete('/members/:id', async (req, res) => {
    const { user, scope } = authOf(req);
    await members.remove(scope, user, idParam(req));
    res.status(204).end();
  });

  return router;
}
