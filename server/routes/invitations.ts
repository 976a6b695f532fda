import { z } from 'zod';
import { acceptInvitationSchema, invitationPreviewRequestSchema, invitationRequestSchema } from '../../shared/schemas/members';
import type { AppContext } from '../context';
import { messageOnly } from '../middleware/validate';
import { idOf, memberArea, publicArea, type ApiArea } from './route-table';

/** /api/invitations: admins invite; the invited person opens the mailed link without signing in. */
export function invitationRoutes(ctx: AppContext): ApiArea[] {
  const { invitations } = ctx;

  // Public: the token itself is the credential.
  const links = publicArea('/invitations', (route) => {
    // The token travels in the body, never in a URL that logs, proxies and browser history keep.
    route.post('/preview', { body: invitationPreviewRequestSchema, refuse: messageOnly }, async ({ body }, res) => {
      res.json(await invitations.preview(body.token));
    });

    route.post('/accept', { body: acceptInvitationSchema }, async ({ body }, res) => {
      const { email } = await invitations.accept(body);
      res.json({ message: `Welcome aboard. Sign in as ${email} with your new password.` });
    });
  });

  const inviting = memberArea('/invitations', (route) => {
    // The same answer whether the address was invited or belongs to another organisation (whose owner is told by mail).
    route.post('/', 'manageMembers', { body: invitationRequestSchema }, async ({ auth: { user, scope }, body }, res) => {
      await invitations.invite(scope, user, body);
      res.status(202).json({ message: `If ${body.email} can join your team, an invitation is on its way.` });
    });

    route.post('/:id/resend', 'manageMembers', { params: z.object({ id: idOf('Invitation') }) }, async ({ auth: { user, scope }, params }, res) => {
      await invitations.resend(scope, user, params.id);
      res.json({ message: 'A new invitation mail is on its way; earlier links no longer work.' });
    });
  });

  return [links, inviting];
}
