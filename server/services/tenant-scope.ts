import type { Knex } from 'knex';
import { notFound } from '../errors';

/**
 * The one place tenant data is reached through: every query built here is limited
 * to the signed-in user's organisation, so forgetting the filter is hard.
 * Tables it serves must have an `organisation_id` column.
 */
export class TenantScope {
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

  /** The same scope inside a transaction. */
  async transaction<R>(work: (scope: TenantScope) => Promise<R>): Promise<R> {
    const db = this.db as Knex;
    return db.transaction((trx) => work(new TenantScope(trx, this.organisationId)));
  }
}
