import type { Knex } from 'knex';
import { allows, rolesWith } from '../../../shared/access/capabilities';
import type { Role } from '../../../shared/schemas/auth';
import type { SeatUsage } from '../../../shared/schemas/billing';
import { AppError, paymentRequired } from '../../errors';

export interface SubscriptionRow {
  id: number;
  organisation_id: number;
  customer_ref: string;
  subscription_ref: string;
  item_ref: string;
  price_lookup_key: string | null;
  status: 'active' | 'past_due' | 'canceled';
  seats: number;
  current_period_end: Date | null;
  cancel_at_period_end: boolean | number;
}

/** Members in these states hold their seat (an invitation reserves one until it is revoked). */
const SEAT_HOLDING_STATUSES = ['active', 'invited'] as const;

export const takesSeat = (role: Role): boolean => allows(role, 'takeSeat');

/**
 * Locks the organisation's row until the transaction ends. Every change to seats in use
 * or seats paid (invitations, role changes, resizes, webhook updates) takes this lock first,
 * so counting and writing cannot interleave between two requests.
 */
export async function lockOrganisation(trx: Knex.Transaction, organisationId: number): Promise<void> {
  await trx('organisations').where({ id: organisationId }).forUpdate().first('id');
}

export function subscriptionOf(db: Knex | Knex.Transaction, organisationId: number): Promise<SubscriptionRow | undefined> {
  return db<SubscriptionRow>('subscriptions').where({ organisation_id: organisationId }).first();
}

export async function seatsInUse(db: Knex | Knex.Transaction, organisationId: number): Promise<number> {
  const row = await db('users')
    .where({ organisation_id: organisationId })
    .whereIn('role', rolesWith('takeSeat'))
    .whereIn('status', SEAT_HOLDING_STATUSES)
    .count({ n: '*' })
    .first();
  return Number(row?.n ?? 0);
}

export const isActive = (row: SubscriptionRow | undefined): row is SubscriptionRow => row?.status === 'active';

export async function seatUsage(db: Knex | Knex.Transaction, organisationId: number): Promise<SeatUsage> {
  const [row, inUse] = await Promise.all([subscriptionOf(db, organisationId), seatsInUse(db, organisationId)]);
  return { paid: isActive(row) ? row.seats : 0, inUse, active: isActive(row) };
}

export const NO_SUBSCRIPTION =
  'Your organisation has no active seat plan, so runs cannot be started and paid members cannot be added. An admin can buy seats under Seats & billing.';

/** Inside a transaction holding lockOrganisation: refuses when `extra` more seats would exceed those paid. */
export async function assertFreeSeats(trx: Knex.Transaction, organisationId: number, extra: number): Promise<void> {
  const row = await subscriptionOf(trx, organisationId);
  if (!isActive(row)) throw paymentRequired(NO_SUBSCRIPTION);
  const inUse = await seatsInUse(trx, organisationId);
  if (inUse + extra > row.seats) {
    throw new AppError(
      409,
      'no_free_seat',
      `All ${row.seats} paid seats are taken (${inUse} in use). Add seats under Seats & billing to invite another admin, consultant or scientist; clients need no seat.`,
      undefined,
      { paid: row.seats, inUse },
    );
  }
}
