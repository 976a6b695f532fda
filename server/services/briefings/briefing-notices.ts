import type { UserRow } from '../auth/auth-service';
import type { MailService } from '../mail/mail-service';
import { briefingSharedMail, briefingVersionMail } from '../mail/mail-texts';
import type { TenantScope } from '../tenant-scope';

/**
 * Mails to clients about their briefings: when one is shared with them and when a new version of
 * one shared with them is published, each with the link that opens it. Only active accounts are
 * told (an invited client gets the invitation instead); a mail that cannot go out, or an address
 * over its hourly share, leaves the share or the version as it is.
 */
export class BriefingNotices {
  constructor(
    private readonly mail: MailService,
    private readonly publicUrl: () => string,
  ) {}

  async shared(scope: TenantScope, actor: UserRow, briefingId: number, userIds: number[]): Promise<void> {
    if (userIds.length === 0) return;
    const { title, organisationName, recipients } = await this.context(scope, briefingId, userIds);
    const content = briefingSharedMail({ sharerName: actor.name, organisationName, title, link: this.link(briefingId) });
    await this.sendAll(recipients, 'briefing_shared', content);
  }

  async published(scope: TenantScope, actor: UserRow, briefingId: number, version: number): Promise<void> {
    const shares = await scope.from('briefing_shares').where({ briefing_id: briefingId }).pluck('user_id');
    if (shares.length === 0) return;
    const { title, organisationName, recipients } = await this.context(scope, briefingId, shares.map(Number));
    const content = briefingVersionMail({ publisherName: actor.name, organisationName, title, version, link: this.link(briefingId) });
    await this.sendAll(recipients, 'briefing_version', content);
  }

  private link(briefingId: number): string {
    return `${this.publicUrl()}/briefings/${briefingId}`;
  }

  private async context(scope: TenantScope, briefingId: number, userIds: number[]) {
    const briefing = await scope.findOr404<{ title: string }>('briefings', briefingId, 'Briefing');
    const organisation = await scope.db('organisations').where({ id: scope.organisationId }).first('name');
    const recipients: string[] = await scope.from('users').whereIn('id', userIds).where({ role: 'client', status: 'active' }).pluck('email');
    return { title: briefing.title, organisationName: String(organisation.name), recipients };
  }

  private async sendAll(recipients: string[], kind: 'briefing_shared' | 'briefing_version', content: { subject: string; text: string }): Promise<void> {
    for (const to of recipients) {
      if (!(await this.mail.withinLimit(to))) continue;
      await this.mail.send({ to, kind, ...content }).catch(() => undefined);
    }
  }
}
