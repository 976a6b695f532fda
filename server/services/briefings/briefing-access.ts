import { allows } from '../../../shared/access/capabilities';
import type { UserRow } from '../auth/auth-service';
import { notFound } from '../../errors';
import type { TenantScope } from '../tenant-scope';

export interface BriefingRow {
  id: number;
  organisation_id: number;
  catchment_id: number;
  title: string;
  summary: string;
  selection: string | object;
  latest_version: number;
  created_by: number | null;
  created_at: Date;
  updated_at: Date;
}

/** Whether the user writes briefings (and so sees every briefing and comment of the organisation). */
export const writes = (user: UserRow) => allows(user.role, 'writeBriefings');

/**
 * The briefing if this user may read it: writers see every briefing of their organisation;
 * a client only a published one shared with them. Anything else is "not found", so a
 * client cannot even learn that a briefing exists.
 */
export async function readableBriefing(scope: TenantScope, user: UserRow, id: number): Promise<BriefingRow> {
  const briefing = await scope.findOr404<BriefingRow>('briefings', id, 'Briefing');
  if (writes(user)) return briefing;
  if (user.role !== 'client' || briefing.latest_version === 0) throw notFound('Briefing');
  const share = await scope.from('briefing_shares').where({ briefing_id: id, user_id: user.id }).first('id');
  if (!share) throw notFound('Briefing');
  return briefing;
}
