import type { Knex } from 'knex';
import type { AcceptInvitation, InvitationPreview, InvitationRequest, Member } from '../../../shared/schemas/members';
import { AppError, conflict } from '../../errors';
import type { AuthService, UserRow } from '../auth/auth-service';
import { assertFreeSeats, lockOrganisation, takesSeat } from '../billing/seats';
import { hashMailToken, newMailToken } from '../mail/mail-tokens';
import type { MailService } from '../mail/mail-service';
import { invitationMail, invitationRefusedMail } from '../mail/mail-texts';
import type { TenantScope } from '../tenant-scope';
import type { MembersService } from './members-service';
import { invalidLink, tooManyMails } from './mail-link-errors';

export const INVITATION_VALID_DAYS = 7;
const ALREADY_MEMBER = 'This address is already a member of your team.';

/** Invitations by mail: an `invited` member holding a seat, and a single-use token to join with. */
export class InvitationService {
  constructor(
    private readonly db: Knex,
    private readonly auth: AuthService,
    private readonly mail: MailService,
    private readonly members: MembersService,
    private readonly publicUrl: () => string,
  ) {}

  /**
   * Counting seats and adding the member happen under the organisation's lock, so seats can never
   * be exceeded. An address of another organisation's account is not invited and not named to the
   * inviter: its owner is told by mail, and the inviter gets the same answer as for a new address
   * (null instead of the member).
   */
  async invite(scope: TenantScope, inviter: UserRow, request: InvitationRequest): Promise<Member | null> {
    if (!(await this.mail.withinLimit(request.email))) throw tooManyMails();
    const foreign = await this.db('users').where({ email: request.email }).whereNot({ organisation_id: scope.organisationId }).first('id');
    if (foreign) {
      await this.tellOwnerOfRefusal(scope, request.email);
      return null;
    }
    const { id, token } = await scope.transaction(async (s) => {
      const trx = s.db as Knex.Transaction;
      await lockOrganisation(trx, s.organisationId);
      if (takesSeat(request.role)) await assertFreeSeats(trx, s.organisationId, 1);
      const existing = await trx('users').where({ email: request.email }).first('id', 'organisation_id', 'status');
      if (existing && existing.organisation_id === s.organisationId && existing.status === 'disabled') {
        // A removed member invited again: the same account comes back as a fresh invitation.
        await s.from('users').where({ id: existing.id }).update({ name: request.name, role: request.role, status: 'invited', password_hash: null, updated_at: new Date() });
        return { id: existing.id as number, token: await this.issueToken(trx, s.organisationId, existing.id, inviter.id) };
      }
      if (existing) throw conflict(ALREADY_MEMBER, 'email');
      // Two admins inviting the same address at once: the unique key decides (409, by the error handler).
      const userId = await s.insert('users', { email: request.email, name: request.name, role: request.role, status: 'invited' });
      return { id: userId, token: await this.issueToken(trx, s.organisationId, userId, inviter.id) };
    });
    await this.sendInvitation(scope, inviter, id, token);
    return this.members.get(scope, id);
  }

  /** A fresh link for a pending invitation; earlier links stop working. */
  async resend(scope: TenantScope, inviter: UserRow, userId: number): Promise<void> {
    const member = await scope.findOr404<UserRow>('users', userId, 'Invitation');
    if (member.status !== 'invited') throw conflict('This member has already joined.');
    if (!(await this.mail.withinLimit(member.email))) throw tooManyMails();
    const token = await this.db.transaction((trx) => this.issueToken(trx, scope.organisationId, userId, inviter.id));
    await this.sendInvitation(scope, inviter, userId, token);
  }

  async preview(token: string): Promise<InvitationPreview> {
    const row = await this.db('invitations as i')
      .join('users as u', 'u.id', 'i.user_id')
      .join('organisations as o', 'o.id', 'i.organisation_id')
      .where({ 'i.token_hash': hashMailToken(token), 'u.status': 'invited' })
      .whereNull('i.used_at')
      .where('i.expires_at', '>', new Date())
      .first('u.email', 'u.name', 'u.role', 'o.name as organisationName');
    if (!row) throw invalidLink('invitation');
    return row as InvitationPreview;
  }

  /** Uses the token (once), sets the password and makes the member active. */
  async accept(input: AcceptInvitation): Promise<{ email: string }> {
    const passwordHash = await this.auth.hashNewPassword(input.password);
    return this.db.transaction(async (trx) => {
      const invitation = await trx('invitations')
        .where({ token_hash: hashMailToken(input.token) })
        .whereNull('used_at')
        .where('expires_at', '>', new Date())
        .forUpdate()
        .first('id', 'user_id');
      if (!invitation) throw invalidLink('invitation');
      const user = await trx<UserRow>('users').where({ id: invitation.user_id, status: 'invited' }).first();
      if (!user) throw invalidLink('invitation');
      await trx('invitations').where({ id: invitation.id }).update({ used_at: new Date() });
      await trx('users')
        .where({ id: user.id })
        .update({ name: input.name, password_hash: passwordHash, status: 'active', updated_at: new Date() });
      return { email: user.email };
    });
  }

  private async tellOwnerOfRefusal(scope: TenantScope, email: string): Promise<void> {
    const organisation = await this.db('organisations').where({ id: scope.organisationId }).first('name');
    const mail = { to: email, kind: 'invitation_refused' as const, ...invitationRefusedMail({ organisationName: organisation.name }) };
    void this.mail.send(mail).catch(() => undefined);
  }

  private async issueToken(trx: Knex.Transaction, organisationId: number, userId: number, inviterId: number): Promise<string> {
    const { token, hash } = newMailToken();
    await trx('invitations').where({ user_id: userId }).whereNull('used_at').update({ used_at: new Date() });
    await trx('invitations').insert({
      organisation_id: organisationId,
      user_id: userId,
      invited_by: inviterId,
      token_hash: hash,
      expires_at: new Date(Date.now() + INVITATION_VALID_DAYS * 86_400_000),
    });
    return token;
  }

  private async sendInvitation(scope: TenantScope, inviter: UserRow, userId: number, token: string): Promise<void> {
    const member = await scope.findOr404<UserRow>('users', userId, 'Invitation');
    const organisation = await this.db('organisations').where({ id: scope.organisationId }).first('name');
    const link = `${this.publicUrl()}/invitation?token=${token}`;
    const content = invitationMail({
      organisationName: organisation.name,
      inviterName: inviter.name,
      role: member.role,
      link,
      validDays: INVITATION_VALID_DAYS,
    });
    try {
      await this.mail.send({ to: member.email, kind: 'invitation', ...content });
    } catch {
      throw new AppError(503, 'mail_unavailable', 'The invitation is saved but its mail could not be sent; use "Send again" in a minute.');
    }
  }
}
