import type { AuditAction, AuditItem } from '../../../shared/schemas/briefings';
import type { UserRow } from '../auth/auth-service';
import type { TenantScope } from '../tenant-scope';

/** Who published, viewed, downloaded, shared and commented, and when: an append-only log per briefing. */
export async function recordEvent(
  scope: TenantScope, briefingId: number, user: Pick<UserRow, 'id' | 'email'>, action: AuditAction, version: number | null, detail = '',
): Promise<void> {
  await scope.insert('briefing_events', { briefing_id: briefingId, user_id: user.id, user_email: user.email, action, version, detail: detail.slice(0, 500) });
}

export async function listEvents(scope: TenantScope, briefingId: number): Promise<AuditItem[]> {
  const rows: Record<string, unknown>[] = await scope.from('briefing_events').where({ briefing_id: briefingId }).orderBy([{ column: 'created_at', order: 'desc' }, { column: 'id', order: 'desc' }]).limit(500);
  return rows.map((r) => ({
    id: Number(r.id), action: r.action as AuditAction, userEmail: String(r.user_email), version: r.version as number | null,
    detail: String(r.detail), createdAt: new Date(r.created_at as string).toISOString(),
  }));
}
