import type { Health } from '../../shared/schemas/health';
import type { AppContext } from '../context';
import { databaseAnswers } from '../db';
import { publicArea, type ApiArea } from './route-table';

interface HealthCheck {
  status: number;
  body: Health;
}

/**
 * GET /api/health: 200 "ok" when the database and Redis answer and at least one worker process is
 * connected; 200 "degraded" with no worker (the API answers, runs wait); 503 when the database or
 * Redis is down (the server is still up and recovers by itself). Probes that arrive while a check
 * is under way share it: a burst of probes costs one database ping and one worker count.
 */
export function healthRoutes(ctx: AppContext): ApiArea {
  let running: Promise<HealthCheck> | undefined;
  const check = async (): Promise<HealthCheck> => {
    const [up, queue] = await Promise.all([databaseAnswers(ctx.db), ctx.queues.health()]);
    const body: Health = { status: up && queue.redis === 'up' && queue.workers > 0 ? 'ok' : 'degraded', db: up ? 'up' : 'down', ...queue };
    return { status: up && queue.redis === 'up' ? 200 : 503, body };
  };
  return publicArea('/health', (route) => {
    route.get('/', {}, async (_input, res) => {
      running ??= check().finally(() => { running = undefined; });
      const { status, body } = await running;
      res.status(status).json(body);
    });
  });
}
