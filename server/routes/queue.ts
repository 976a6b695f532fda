import type { AppContext } from '../context';
import { queueStatus } from '../queue/queue-status';
import { memberArea, type ApiArea } from './route-table';

/** /api/queue: the job queue's page for an organisation's admins (its own jobs only). */
export function queueRoutes(ctx: AppContext): ApiArea {
  return memberArea('/queue', (route) => {
    route.get('/', 'watchQueue', {}, async ({ auth: { scope } }, res) => {
      res.json({ status: await queueStatus(ctx.queues, scope, ctx.config.queue.organisationConcurrency) });
    });
  });
}
