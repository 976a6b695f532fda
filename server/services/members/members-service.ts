import { allows } from '../../../shared/access/capabilities';
import type { Knex } from 'knex';
import type { Role } from '../../../shared/schemas/auth';
import type { Member, MembersReply } from '../../../shared/schemas/members';
import { forbidden } from '../../errors';
import type { UserRow } from '../auth/auth-service';
import { assertFreeSeats, lockOrganisation, seatUsage, takesSeat } from '../billing/seats';
import type { TenantScope } from '../tenant-scope';

const MEMBER_COLUMNS = ['id', 'name', 'email', 'role', 'status', 'last_sign_in_at', 'created_at'] as const;

const toMember = (row: Record<string, unknown>): Member =>
  Object.fromEntries(MEMBER_COLUMNS.map((c) => [c, row[c] instanceof Date ? (row[c] as Date).toISOString() : row[c]])) as Member;

/** The organisation's people: list, role changes and removal, with the seat rule applied. */
export class MembersService {
  async list(scope: TenantScope): Promise<MembersReply> {
    const rows = await scope.from('users').select(MEMBER_COLUMNS).orderBy('name');
    return { members: rows.map(toMember), seats: await seatUsage(scope.db, scope.organisationId) };
  }

  async get(scope: TenantScope, id: number): Promise<Member> {
    return toMember(await scope.findOr404('users', id, 'Member'));
  }

  /** A client moving to a paid role needs a free seat; admins cannot change their own role (one admin always remains). */
  async changeRole(scope: TenantScope, actor: UserRow, id: number, role: Role): Promise<Member> {
    if (id === actor.id) throw forbidden('You cannot change your own role; ask another admin.');
    return scope.transaction(async (s) => {
      const trx = s.db as Knex.Transaction;
      await lockOrganisation(trx, s.organisationId);
      await assertStillAdmin(s, actor.id);
      const member = await s.findOr404<UserRow>('users', id, 'Member');
      if (member.status === 'disabled') throw forbidden('This member has been removed.');
      if (member.role === 'admin' && role !== 'admin') await assertAnotherAdmin(s, id);
      if (!takesSeat(member.role) && takesSeat(role)) await assertFreeSeats(trx, s.organisationId, 1);
      await s.from('users').where({ id }).update({ role, updated_at: new Date() });
      return toMember(await s.findOr404('users', id, 'Member'));
    });
  }

  /**
   * Removes a member: a pending invitation disappears, an active member is switched
   * off (sessions end, the seat is freed) and keeps their name on past work.
   */
  async remove(scope: TenantScope, actor: UserRow, id: number): Promise<void> {
    if (id === actor.id) throw forbidden('You cannot remove yourself; ask another admin.');
    await scope.transaction(async (s) => {
      await lockOrganisation(s.db as Knex.Transaction, s.organisationId);
      await assertStillAdmin(s, actor.id);
      const member = await s.findOr404<UserRow>('users', id, 'Member');
      if (member.role === 'admin' && member.status === 'active') await assertAnotherAdmin(s, id);
      if (member.status === 'invited') {
        await s.from('users').where({ id }).delete();
        return;
      }
      await s.from('users').where({ id }).update({ status: 'disabled', token_version: member.token_version + 1, updated_at: new Date() });
    });
  }
}

/**
 * Inside the organisation lock: the acting admin may have been demoted or removed by another
 * admin a moment ago, after this request was authorised; the same capability is asked again.
 */
async function assertStillAdmin(scope: TenantScope, actorId: number): Promise<void> {
  const actor = await scope.from<UserRow>('users').where({ id: actorId }).first('role', 'status');
  if (!actor || !allows(actor.role, 'manageMembers') || actor.status !== 'active') throw forbidden('You are no longer an admin of this organisation.');
}

/** Inside the organisation lock: an organisation always keeps at least one active admin. */
async function assertAnotherAdmin(scope: TenantScope, leavingId: number): Promise<void> {
  const others = await scope.from('users').where({ role: 'admin', status: 'active' }).whereNot({ id: leavingId }).count<{ n: number }[]>({ n: '*' });
  if (Number(others[0]?.n ?? 0) === 0) throw forbidden('The organisation must keep at least one active admin.');
}
