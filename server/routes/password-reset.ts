import { Router } from 'express';
import { resetCompleteSchema, resetRequestSchema } from '../../shared/schemas/members';
import type { AppContext } from '../context';
import { validateBody } from '../middleware/validate';

const SAME_REPLY = 'If an account uses this address, a mail with a reset link is on its way. It works once and for one hour.';

/** /api/password-reset/*: public; the reply to a request is the same whether the address exists or not. */
export function passwordResetRoutes(ctx: AppContext): Router {
  const router = Router();

  router.post('/password-reset/request', validateBody(resetRequestSchema), async (req, res) => {
    await ctx.passwordResets.request(req.body.email);
    res.status(202).json({ message: SAME_REPLY });
  });

  router.post('/password-reset/complete', validateBody(resetCompleteSchema), async (req, res) => {
    await ctx.passwordResets.complete(req.body);
    res.json({ message: 'Your password is changed and every earlier session has ended. Sign in with the new one.' });
  });

  return router;
}
