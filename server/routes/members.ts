import { Router } from 'express';
import type { AppContext } from '../context';
import { authOf, requireAuth } from '../middleware/require-auth';
import { requireRole } from '../middleware/require-role';
import { idParam } from '../middleware/validate';

const MEMBER_COLUMNS = ['id', 'name', 'email', 'role', 'status', 'last_sign_in_at', 'created_at'] as const;

/** /api/members: the organisation's people, for its admins. */
export function memberRoutes(ctx: AppContext): Router {
  const router = Router();
  router.use('/members', requireAuth(ctx), requireRole('admin'));

  router.get('/members', async (req, res) => {
    const rows = await authOf(req).scope.from('users').select(MEMBER_COLUMNS).orderBy('name');
    res.json({ members: rows });
  });

  router.get('/members/:id', async (req, res) => {
    const row = await authOf(req).scope.findOr404('users', idParam(req), 'Member');
    const member = Object.fromEntries(MEMBER_COLUMNS.map((c) => [c, (row as Record<string, unknown>)[c]]));
    res.json({ member });
  });

  return router;
}
