import type { Knex } from 'knex';
import { notFound } from '../errors';

/**
 * The one place tenant data is reached through: every query built here is limited
 * to the signed-in user's organisation, so forgetting the filter is hard.
 * Tables it serves must have an `organisation_id` column.
 */
export class TenantScope {
  /**
   * Set for a request that carries an idempotency key (server/middleware/idempotency-keys.ts):
   * the key's row is marked committed inside the transaction of the request's first write.
   */
  claim?: { id: number; committed: boolean };

  constructor(
    readonly db: Knex | Knex.Transaction,
    readonly organisationId: number,
  ) {}

  /** A query on `table` already filtered to this organisation. */
  from<T extends object = Record<string, unknown>>(table: string): Knex.QueryBuilder<T> {
    return this.db<T>(table).where(`${table}.organisation_id`, this.organisationId);
  }

  /** Inserts rows stamped with this organisation; returns the first insert id. */
  async insert(table: string, row: Record<string, unknown>): Promise<number> {
    if (this.claim && !this.claim.committed && !this.db.isTransaction) return this.transaction((s) => s.insert(table, row));
    const [id] = await this.db(table).insert({ ...row, organisation_id: this.organisationId });
    return Number(id);
  }

  /** The row with this id in this organisation, or a 404 naming `what` (also for other organisations' ids). */
  async findOr404<T extends object = Record<string, unknown>>(table: string, id: number, what: string): Promise<T> {
    if (!Number.isSafeInteger(id) || id <= 0) throw notFound(what);
    const row = await this.from<T>(table).where(`${table}.id`, id).first();
    if (!row) throw notFound(what);
    return row as T;
  }

  /** The same scope inside a transaction (which also marks the request's idempotency key, if any, as committed). */
  async transaction<R>(work: (scope: TenantScope) => Promise<R>): Promise<R> {
    const db = this.db as Knex;
    const claim = this.claim && !this.claim.committed ? this.claim : undefined;
    const result = await db.transaction(async (trx) => {
      const done = await work(new TenantScope(trx, this.organisationId));
      if (claim) await trx('idempotency_keys').where({ id: claim.id }).update({ state: 'committed' });
      return done;
    });
    if (claim) claim.committed = true;
    return result;
  }
}
