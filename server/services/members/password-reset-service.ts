import type { Knex } from 'knex';
import type { ResetComplete } from '../../../shared/schemas/members';
import type { Logger } from '../../logger';
import type { AuthService, UserRow } from '../auth/auth-service';
import { hashMailToken, newMailToken } from '../mail/mail-tokens';
import type { MailService, OutgoingMail } from '../mail/mail-service';
import { AppError, conflict } from '../../errors';
import type { TenantScope } from '../tenant-scope';
import { passwordResetMail } from '../mail/mail-texts';
import { invalidLink, tooManyMails } from './mail-link-errors';

export const RESET_VALID_MINUTES = 60;

/** Password resets by mail; asking never tells whether an address has an account. */
export class PasswordResetService {
  constructor(
    private readonly db: Knex,
    private readonly auth: AuthService,
    private readonly mail: MailService,
    private readonly publicUrl: () => string,
    private readonly logger: Logger,
  ) {}

  /**
   * Mails a reset link to an active account's address. Unknown addresses and addresses
   * over their hourly limit get the same silence; the mail goes out after the reply.
   */
  async request(email: string): Promise<void> {
    const user = await this.db<UserRow>('users').where({ email, status: 'active' }).first();
    if (!user || !(await this.mail.withinLimit(email))) return;
    const mail = await this.resetMail(user);
    void this.mail.send(mail).catch((error: unknown) => {
      this.logger.error({ err: error, mail: 'password_reset', userId: user.id }, 'mail not sent');
    });
  }

  /**
   * An admin sends a member of their organisation a reset link (a member who forgot their
   * password and cannot reach the form). The member must have joined; the mail says who asked.
   */
  async sendFor(scope: TenantScope, admin: UserRow, memberId: number): Promise<{ message: string }> {
    const member = await scope.findOr404<UserRow>('users', memberId, 'Member');
    if (member.status !== 'active') throw conflict(`${member.name} has not joined yet; send the invitation again instead.`);
    if (!(await this.mail.withinLimit(member.email))) throw tooManyMails();
    try {
      await this.mail.send(await this.resetMail(member, admin.name));
    } catch {
      throw new AppError(503, 'mail_unavailable', 'The reset mail could not be sent; try again in a minute.');
    }
    return { message: `A link to choose a new password was mailed to ${member.email}; it works once and for ${RESET_VALID_MINUTES} minutes.` };
  }

  private async resetMail(user: UserRow, requestedBy?: string): Promise<OutgoingMail> {
    const { token, hash } = newMailToken();
    await this.db('password_reset_tokens').insert({
      user_id: user.id,
      token_hash: hash,
      expires_at: new Date(Date.now() + RESET_VALID_MINUTES * 60_000),
    });
    const content = passwordResetMail({ link: `${this.publicUrl()}/reset-password?token=${token}`, validMinutes: RESET_VALID_MINUTES, requestedBy });
    return { to: user.email, kind: 'password_reset', ...content };
  }

  /** Uses the token once, sets the password, ends every session and voids the user's other reset links. */
  async complete(input: ResetComplete): Promise<void> {
    const passwordHash = await this.auth.hashNewPassword(input.password);
    await this.db.transaction(async (trx: Knex.Transaction) => {
      const reset = await trx('password_reset_tokens')
        .where({ token_hash: hashMailToken(input.token) })
        .whereNull('used_at')
        .where('expires_at', '>', new Date())
        .forUpdate()
        .first('id', 'user_id');
      if (!reset) throw invalidLink('reset');
      const user = await trx<UserRow>('users').where({ id: reset.user_id, status: 'active' }).first();
      if (!user) throw invalidLink('reset');
      await trx('password_reset_tokens').where({ user_id: user.id }).whereNull('used_at').update({ used_at: new Date() });
      await trx('users')
        .where({ id: user.id })
        .update({ password_hash: passwordHash, token_version: user.token_version + 1, updated_at: new Date() });
    });
  }
}
