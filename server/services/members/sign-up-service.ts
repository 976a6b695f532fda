import type { Knex } from 'knex';
import type { SignUpRequest } from '../../../shared/schemas/auth';
import { isUniqueViolation } from '../../db-errors';
import type { Logger } from '../../logger';
import type { AuthService, UserRow } from '../auth/auth-service';
import { hashMailToken, newMailToken } from '../mail/mail-tokens';
import type { MailService, OutgoingMail } from '../mail/mail-service';
import { accountExistsMail, signUpMail } from '../mail/mail-texts';
import { invalidLink } from './mail-link-errors';

export const SIGN_UP_VALID_DAYS = 2;

/**
 * Sign-up without telling anyone which addresses have accounts: every request gets the same
 * answer and the address's owner learns the rest by mail. A new address gets its organisation
 * and an admin waiting for the link (`invited`, with the password already chosen); an address
 * with an account gets a note saying so. Over the hourly mail limit, nothing is sent.
 */
export class SignUpService {
  constructor(
    private readonly db: Knex,
    private readonly auth: AuthService,
    private readonly mail: MailService,
    private readonly publicUrl: () => string,
    private readonly logger: Logger,
  ) {}

  async request(input: SignUpRequest): Promise<void> {
    const passwordHash = await this.auth.hashNewPassword(input.password);
    if (!(await this.mail.withinLimit(input.email))) return;
    const existing = await this.db('users').where({ email: input.email }).first('id');
    const token = existing ? null : await this.create(input, passwordHash);
    const base = this.publicUrl();
    const mail: OutgoingMail = token
      ? { to: input.email, kind: 'sign_up', ...signUpMail({ organisationName: input.organisationName, link: `${base}/confirm-sign-up?token=${token}`, validDays: SIGN_UP_VALID_DAYS }) }
      : { to: input.email, kind: 'account_exists', ...accountExistsMail({ signInLink: `${base}/sign-in`, resetLink: `${base}/forgot-password` }) };
    // After the answer, so both cases take the same time to answer.
    void this.mail.send(mail).catch((error: unknown) => this.logger.error({ err: error, mail: mail.kind }, 'mail not sent'));
  }

  /** Uses the link (once): the admin becomes active and the caller signs them in. */
  async confirm(token: string): Promise<UserRow> {
    return this.db.transaction(async (trx) => {
      const invitation = await trx('invitations')
        .where({ token_hash: hashMailToken(token) })
        .whereNull('used_at')
        .where('expires_at', '>', new Date())
        .forUpdate()
        .first('id', 'user_id');
      if (!invitation) throw invalidLink('sign-up');
      const user = await trx<UserRow>('users').where({ id: invitation.user_id, status: 'invited' }).whereNotNull('password_hash').first();
      if (!user) throw invalidLink('sign-up');
      await trx('invitations').where({ id: invitation.id }).update({ used_at: new Date() });
      await trx('users').where({ id: user.id }).update({ status: 'active', updated_at: new Date() });
      return { ...user, status: 'active' as const };
    });
  }

  /** The organisation, its admin waiting for the link, and the link's token; null when the address was taken a moment ago. */
  private async create(input: SignUpRequest, passwordHash: string): Promise<string | null> {
    const { token, hash } = newMailToken();
    try {
      await this.db.transaction(async (trx) => {
        const [organisationId] = await trx('organisations').insert({ name: input.organisationName });
        const [userId] = await trx('users').insert({
          organisation_id: organisationId, email: input.email, name: input.name, password_hash: passwordHash, role: 'admin', status: 'invited',
        });
        await trx('invitations').insert({
          organisation_id: organisationId, user_id: userId, invited_by: userId, token_hash: hash,
          expires_at: new Date(Date.now() + SIGN_UP_VALID_DAYS * 86_400_000),
        });
      });
      return token;
    } catch (error) {
      if (isUniqueViolation(error)) return null;
      throw error;
    }
  }
}
