import { z } from 'zod';

export const ROLES = ['admin', 'consultant', 'scientist', 'client'] as const;
export const roleSchema = z.enum(ROLES);
export type Role = z.infer<typeof roleSchema>;

export const USER_STATUSES = ['active', 'invited', 'disabled'] as const;
export const userStatusSchema = z.enum(USER_STATUSES);

export const PASSWORD_MIN_CHARS = 12;
/** bcrypt reads at most 72 bytes; longer passwords would be silently cut, so they are refused. */
export const PASSWORD_MAX_BYTES = 72;

const utf8Bytes = (s: string) => new TextEncoder().encode(s).length;

export const passwordSchema = z
  .string({ error: 'Enter a password.' })
  .min(PASSWORD_MIN_CHARS, { error: `Use at least ${PASSWORD_MIN_CHARS} characters.` })
  .refine((p) => utf8Bytes(p) <= PASSWORD_MAX_BYTES, {
    error: `Use at most ${PASSWORD_MAX_BYTES} bytes (about ${PASSWORD_MAX_BYTES} plain letters; accented letters and symbols count double or more).`,
  });
// Passwords from breach corpuses are refused by the server when one is set (server/services/auth/common-passwords.ts).

export const emailSchema = z
  .string({ error: 'Enter an e-mail address.' })
  .trim()
  .toLowerCase()
  .pipe(z.email({ error: 'Enter a valid e-mail address.' }).max(254));

export const signInSchema = z.object({
  email: emailSchema,
  // No strength rules at sign-in: the check is against the stored hash only.
  password: z.string({ error: 'Enter your password.' }).min(1, { error: 'Enter your password.' }).max(1024),
});
export type SignInRequest = z.infer<typeof signInSchema>;

export const signUpSchema = z.object({
  organisationName: z.string().trim().min(2, { error: 'Enter the organisation name (at least 2 characters).' }).max(120),
  name: z.string().trim().min(1, { error: 'Enter your name.' }).max(120),
  email: emailSchema,
  password: passwordSchema,
});
export type SignUpRequest = z.infer<typeof signUpSchema>;

/** The answer to every sign-up request, whether the address is new or already has an account. */
export const SIGN_UP_REPLY = 'Check your inbox: a mail is on its way to this address. Open its link to finish (if the address already has an account, the mail says so).';

/** POST /api/auth/password: the current password proves it is the user, not someone at an unlocked screen. */
export const passwordChangeSchema = z.object({
  currentPassword: z.string({ error: 'Enter your current password.' }).min(1, { error: 'Enter your current password.' }).max(1024),
  newPassword: passwordSchema,
});
export type PasswordChange = z.infer<typeof passwordChangeSchema>;

export const organisationSchema = z.object({
  id: z.number().int(),
  name: z.string(),
});
export type Organisation = z.infer<typeof organisationSchema>;

export const userSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  email: z.string(),
  role: roleSchema,
  status: userStatusSchema,
});
export type User = z.infer<typeof userSchema>;

export const meResponseSchema = z.object({ user: userSchema, organisation: organisationSchema });
export type MeResponse = z.infer<typeof meResponseSchema>;
