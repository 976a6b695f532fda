import { Router } from 'express';
import { acceptInvitationSchema, invitationRequestSchema, mailTokenSchema } from '../../shared/schemas/members';
import type { AppContext } from '../context';
import { authOf, requireAuth } from '../middleware/require-auth';
import { requireRole } from '../middleware/require-role';
import { idParam, parseWith, validateBody } from '../middleware/validate';

/** /api/invitations: admins invite; the invited person opens the mailed link without signing in. */
export function invitationRoutes(ctx: AppContext): Router {
  const router = Router();
  const { invitations } = ctx;
  const admin = [requireAuth(ctx), requireRole('admin')];

  // Public: the token itself is the credential.
  router.get('/invitations/preview', async (req, res) => {
    res.json(await invitations.preview(parseWith(mailTokenSchema, req.query.token)));
  });

  router.post('/invitations/accept', validateBody(acceptInvitationSchema), async (req, res) => {
    const { email } = await invitations.accept(req.body);
    res.json({ message: `Welcome aboard. Sign in as ${email} with your new password.` });
  });

  router.post('/invitations', ...admin, validateBody(invitationRequestSchema), async (req, res) => {
    const { user, scope } = authOf(req);
    res.status(201).json({ member: await invitations.invite(scope, user, req.body) });
  });

  router.post('/invitations/:id/resend', ...admin, async (req, res) => {
    const { user, scope } = authOf(req);
    await invitations.resend(scope, user, idParam(req));
    res.json({ message: 'A new invitation mail is on its way; earlier links no longer work.' });
  });

  return router;
}
