import type { Knex } from 'knex';
import type { Role } from '../../../shared/schemas/auth';
import type { Member, MembersReply } from '../../../shared/schemas/members';
import { forbidden } from '../../errors';
import type { UserRow } from '../auth-service';
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
      const member = await s.findOr404<UserRow>('users', id, 'Member');
      if (member.status === 'disabled') throw forbidden('This member has been removed.');
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
      const member = await s.findOr404<UserRow>('users', id, 'Member');
      if (member.status === 'invited') {
        await s.from('users').where({ id }).delete();
        return;
      }
      await s.from('users').where({ id }).update({ status: 'disabled', token_version: member.token_version + 1, updated_at: new Date() });
    });
  }
}
