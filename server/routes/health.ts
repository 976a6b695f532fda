import type { Health } from '../../shared/schemas/health';
import type { AppContext } from '../context';
import { databaseAnswers } from '../db';
import { publicArea, type ApiArea } from './route-table';

/** GET /api/health: 200 when the database answers, 503 (server still up) when not. */
export function healthRoutes(ctx: AppContext): ApiArea {
  return publicArea('/health', (route) => {
    route.get('/', {}, async (_input, res) => {
      const up = await databaseAnswers(ctx.db);
      const body: Health = up ? { status: 'ok', db: 'up' } : { status: 'degraded', db: 'down' };
      res.status(up ? 200 : 503).json(body);
    });
  });
}
