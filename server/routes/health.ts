import { Router } from 'express';
import type { Health } from '../../shared/schemas/api-error';
import type { AppContext } from '../context';
import { databaseAnswers } from '../db';

/** GET /api/health: 200 when the database answers, 503 (server still up) when not. */
export function healthRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get('/health', async (_req, res) => {
    const up = await databaseAnswers(ctx.db);
    const body: Health = up ? { status: 'ok', db: 'up' } : { status: 'degraded', db: 'down' };
    res.status(up ? 200 : 503).json(body);
  });
  return router;
}
