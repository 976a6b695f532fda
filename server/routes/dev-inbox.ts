import type { AppContext } from '../context';
import { notFound } from '../errors';
import { publicArea, type ApiArea } from './route-table';

/**
 * GET /api/dev/inbox: mails kept by the local catcher. Open to anyone, because the
 * person reading an invitation is not signed in yet; it exists only outside production
 * and only when a catcher runs beside the app, and answers 404 otherwise.
 */
export function devInboxRoutes(ctx: AppContext): ApiArea {
  return publicArea('/dev/inbox', (route) => {
    route.get('/', {}, (_input, res) => {
      if (ctx.config.env === 'production' || !ctx.devInbox) throw notFound('Development inbox');
      res.json({ messages: ctx.devInbox.messages() });
    });
  });
}
