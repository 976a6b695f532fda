import {
  inboxReplySchema,
  invitationPreviewSchema,
  messageReplySchema,
  type AcceptInvitation,
  type ResetComplete,
} from '@shared/schemas/members';
import { api } from './http';

/** Calls made from mailed links and the sign-in page, without a session. */
export const accountApi = {
  previewInvitation: (token: string) => api.post('/api/invitations/preview', { token }, { schema: invitationPreviewSchema, quiet: true }),
  acceptInvitation: (body: AcceptInvitation) => api.post('/api/invitations/accept', body, { schema: messageReplySchema, quiet: true }),
  requestReset: (email: string) => api.post('/api/password-reset/request', { email }, { schema: messageReplySchema, quiet: true }),
  completeReset: (body: ResetComplete) => api.post('/api/password-reset/complete', body, { schema: messageReplySchema, quiet: true }),
  devInbox: () => api.get('/api/dev/inbox', inboxReplySchema, { quiet: true }),
};
