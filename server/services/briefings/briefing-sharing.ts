import { rolesWith } from '../../../shared/access/capabilities';
import type { CommentItem } from '../../../shared/schemas/briefings';
import { notFound, validationFailed } from '../../errors';
import type { UserRow } from '../auth/auth-service';
import type { InvitationService } from '../members/invitation-service';
import type { TenantScope } from '../tenant-scope';
import { recordEvent } from './briefing-audit';
import type { BriefingNotices } from './briefing-notices';
import { readableBriefing, writes } from './briefing-access';

/** A readable name for an invited client until they choose their own: the address's local part. */
const nameFromEmail = (email: string) => email.split('@')[0].replace(/[._-]+/g, ' ').slice(0, 120) || email;

/** Sharing briefings with client users (inviting new ones at no seat cost) and the comments on a briefing. */
export class BriefingSharing {
  constructor(
    private readonly invitations: InvitationService,
    private readonly notices: BriefingNotices,
  ) {}

  /**
   * Shares with each address: an existing client of this organisation, or a new client account
   * created by invitation. Team members are refused by field; another organisation's address is
   * left out without saying so (its owner is told by mail), as when it is invited to the team.
   * Existing clients the briefing is newly shared with get a mail with its link.
   */
  async share(scope: TenantScope, actor: UserRow, briefingId: number, emails: string[]): Promise<void> {
    await scope.findOr404('briefings', briefingId, 'Briefing');
    const newlyShared: number[] = [];
    for (const [i, email] of [...new Set(emails)].entries()) {
      const field = `emails.${i}`;
      const existing = await scope.db('users').where({ email }).first('id', 'organisation_id', 'role');
      let userId: number;
      if (!existing || existing.organisation_id !== scope.organisationId) {
        const invited = await this.invitations.invite(scope, actor, { email, name: nameFromEmail(email), role: 'client' });
        if (!invited) continue;
        userId = invited.id;
        await recordEvent(scope, briefingId, actor, 'invited', null, email);
      } else if (existing.role !== 'client') {
        throw validationFailed(`${email} is a ${existing.role} in your team, not a client; team members open briefings from the list.`, field);
      } else userId = existing.id;
      const inserted = await scope.db('briefing_shares')
        .insert({ organisation_id: scope.organisationId, briefing_id: briefingId, user_id: userId, shared_by: actor.id })
        .onConflict(['briefing_id', 'user_id']).ignore();
      if (inserted.length && inserted[0]) {
        await recordEvent(scope, briefingId, actor, 'shared', null, email);
        newlyShared.push(userId);
      }
    }
    await this.notices.shared(scope, actor, briefingId, newlyShared);
  }

  async unshare(scope: TenantScope, actor: UserRow, briefingId: number, userId: number): Promise<void> {
    await scope.findOr404('briefings', briefingId, 'Briefing');
    const user = await scope.from('users').where({ id: userId }).first('email');
    const removed = await scope.from('briefing_shares').where({ briefing_id: briefingId, user_id: userId }).delete();
    if (!removed || !user) throw notFound('Share');
    await recordEvent(scope, briefingId, actor, 'unshared', null, String(user.email));
  }

  /** Writers see every comment; a client sees the team's and their own, never another client's. */
  async comments(scope: TenantScope, user: UserRow, briefingId: number): Promise<CommentItem[]> {
    await readableBriefing(scope, user, briefingId);
    const query = scope.from('briefing_comments').leftJoin('users', 'users.id', 'briefing_comments.user_id')
      .where('briefing_comments.briefing_id', briefingId).orderBy(['briefing_comments.created_at', 'briefing_comments.id'])
      .select('briefing_comments.id', 'briefing_comments.version', 'briefing_comments.body', 'briefing_comments.created_at', 'users.name', 'users.role');
    if (!writes(user)) {
      query.where((q) => {
        q.where('briefing_comments.user_id', user.id).orWhereIn('users.role', rolesWith('writeBriefings'));
      });
    }
    const rows: Record<string, unknown>[] = await query;
    return rows.map((r) => ({
      id: Number(r.id), author: String(r.name ?? 'former member'), role: String(r.role ?? ''), version: r.version === null ? null : Number(r.version),
      body: String(r.body), createdAt: new Date(r.created_at as string).toISOString(),
    }));
  }

  async comment(scope: TenantScope, user: UserRow, briefingId: number, body: string): Promise<void> {
    const b = await readableBriefing(scope, user, briefingId);
    const version = b.latest_version || null;
    await scope.insert('briefing_comments', { briefing_id: briefingId, user_id: user.id, version, body });
    await recordEvent(scope, briefingId, user, 'commented', version, body.slice(0, 120));
  }
}
