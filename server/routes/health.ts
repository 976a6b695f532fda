import type { Health } from '../../shared/schemas/health';
import type { AppContext } from '../context';
import { databaseAnswers } from '../db';
import { publicArea, type ApiArea } from './route-table';

/**
 * GET /api/health: 200 "ok" when the database and Redis answer and at least one worker process is
 * connected; 200 "degraded" with no worker (the API answers, runs wait); 503 when the database or
 * Redis is down (the server is still up and recovers by itself).
 */
export function healthRoutes(ctx: AppContext): ApiArea {
  return publicArea('/health', (route) => {
    route.get('/', {}, async (_input, res) => {
      const [up, queue] = await Promise.all([databaseAnswers(ctx.db), ctx.queues.health()]);
      const body: Health = { status: up && queue.redis === 'up' && queue.workers > 0 ? 'ok' : 'degraded', db: up ? 'up' : 'down', ...queue };
      res.status(up && queue.redis === 'up' ? 200 : 503).json(body);
    });
  });
}
