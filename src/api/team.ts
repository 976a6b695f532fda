import { z } from 'zod';
import type { Role } from '@shared/schemas/auth';
import { memberSchema, membersReplySchema, messageReplySchema, type InvitationRequest } from '@shared/schemas/members';
import { api } from './http';

const memberReply = z.object({ member: memberSchema });

/** Members, roles and invitations of the signed-in admin's organisation. */
export const teamApi = {
  list: () => api.get('/api/members', membersReplySchema),
  changeRole: (id: number, role: Role) => api.patch(`/api/members/${id}`, { role }, { schema: memberReply }),
  remove: (id: number) => api.delete(`/api/members/${id}`),
  invite: (body: InvitationRequest) => api.post('/api/invitations', body, { schema: messageReplySchema, quiet: true }),
  sendPasswordReset: (id: number) => api.post(`/api/members/${id}/password-reset`, undefined, { schema: messageReplySchema }),
  resend: (id: number) => api.post(`/api/invitations/${id}/resend`, undefined, { schema: messageReplySchema }),
};
