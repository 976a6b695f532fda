import { z } from 'zod';
import { acceptInvitationSchema, invitationPreviewQuerySchema, invitationRequestSchema } from '../../shared/schemas/members';
import type { AppContext } from '../context';
import { messageOnly } from '../middleware/validate';
import { idOf, memberArea, publicArea, type ApiArea } from './route-table';

/** /api/invitations: admins invite; the invited person opens the mailed link without signing in. */
export function invitationRoutes(ctx: AppContext): ApiArea[] {
  const { invitations } = ctx;

  // Public: the token itself is the credential.
  const links = publicArea('/invitations', (route) => {
    route.get('/preview', { query: invitationPreviewQuerySchema, refuse: messageOnly }, async ({ query }, res) => {
      res.json(await invitations.preview(query.token));
    });

    route.post('/accept', { body: acceptInvitationSchema }, async ({ body }, res) => {
      const { email } = await invitations.accept(body);
      res.json({ message: `Welcome aboard. Sign in as ${email} with your new password.` });
    });
  });

  const inviting = memberArea('/invitations', (route) => {
    route.post('/', 'manageMembers', { body: invitationRequestSchema }, async ({ auth: { user, scope }, body }, res) => {
      res.status(201).json({ member: await invitations.invite(scope, user, body) });
    });

    route.post('/:id/resend', 'manageMembers', { params: z.object({ id: idOf('Invitation') }) }, async ({ auth: { user, scope }, params }, res) => {
      await invitations.resend(scope, user, params.id);
      res.json({ message: 'A new invitation mail is on its way; earlier links no longer work.' });
    });
  });

  return [links, inviting];
}
