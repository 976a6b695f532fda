import { z } from 'zod';
import { emailSchema, passwordSchema, roleSchema, userStatusSchema } from './auth';
import { seatUsageSchema } from './billing';

export const memberSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  email: z.string(),
  role: roleSchema,
  status: userStatusSchema,
  last_sign_in_at: z.coerce.string().nullable(),
  created_at: z.coerce.string(),
});
export type Member = z.infer<typeof memberSchema>;

export const membersReplySchema = z.object({ members: z.array(memberSchema), seats: seatUsageSchema });
export type MembersReply = z.infer<typeof membersReplySchema>;

export const roleChangeSchema = z.object({ role: roleSchema });
export type RoleChange = z.infer<typeof roleChangeSchema>;

export const invitationRequestSchema = z.object({
  email: emailSchema,
  name: z.string({ error: 'Enter a name.' }).trim().min(1, { error: 'Enter a name.' }).max(120),
  role: roleSchema,
});
export type InvitationRequest = z.infer<typeof invitationRequestSchema>;

/** A token from a mailed link: 32 random bytes in base64url. */
export const mailTokenSchema = z
  .string({ error: 'The link is missing its token.' })
  .regex(/^[A-Za-z0-9_-]{43}$/, { error: 'This link is not valid.' });

/** POST /api/auth/sign-up/confirm: the token of the mailed link that finishes a sign-up. */
export const signUpConfirmSchema = z.object({ token: mailTokenSchema });

export const invitationPreviewSchema = z.object({
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  organisationName: z.string(),
});
export type InvitationPreview = z.infer<typeof invitationPreviewSchema>;

export const acceptInvitationSchema = z.object({
  token: mailTokenSchema,
  name: z.string({ error: 'Enter your name.' }).trim().min(1, { error: 'Enter your name.' }).max(120),
  password: passwordSchema,
});
export type AcceptInvitation = z.infer<typeof acceptInvitationSchema>;

export const resetRequestSchema = z.object({ email: emailSchema });
export type ResetRequest = z.infer<typeof resetRequestSchema>;

export const resetCompleteSchema = z.object({ token: mailTokenSchema, password: passwordSchema });
export type ResetComplete = z.infer<typeof resetCompleteSchema>;

export const messageReplySchema = z.object({ message: z.string() });

export const inboxMessageSchema = z.object({
  id: z.number().int(),
  receivedAt: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
});
export type InboxMessage = z.infer<typeof inboxMessageSchema>;
export const inboxReplySchema = z.object({ messages: z.array(inboxMessageSchema) });

/** POST /api/invitations/preview { token } */
export const invitationPreviewRequestSchema = z.object({ token: mailTokenSchema });
