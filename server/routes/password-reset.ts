import { resetCompleteSchema, resetRequestSchema } from '../../shared/schemas/members';
import type { AppContext } from '../context';
import { publicArea, type ApiArea } from './route-table';

const SAME_REPLY = 'If an account uses this address, a mail with a reset link is on its way. It works once and for one hour.';

/** /api/password-reset/*: public; the reply to a request is the same whether the address exists or not. */
export function passwordResetRoutes(ctx: AppContext): ApiArea {
  return publicArea('/password-reset', (route) => {
    route.post('/request', { body: resetRequestSchema }, async ({ body }, res) => {
      await ctx.passwordResets.request(body.email);
      res.status(202).json({ message: SAME_REPLY });
    });

    route.post('/complete', { body: resetCompleteSchema }, async ({ body }, res) => {
      await ctx.passwordResets.complete(body);
      res.json({ message: 'Your password is changed and every earlier session has ended. Sign in with the new one.' });
    });
  });
}
