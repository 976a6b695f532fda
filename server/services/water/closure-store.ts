import { waterBalanceClosureSchema, type SavedClosure, type WaterBalanceClosure } from '../../../shared/schemas/water-balance';
import type { UserRow } from '../auth/auth-service';
import type { TenantScope } from '../tenant-scope';

interface ClosureRow {
  id: number;
  closure: string | object;
  note: string;
  saved_by_name: string;
  saved_at: Date;
}

const toSaved = (row: ClosureRow): SavedClosure => ({
  id: row.id,
  closure: waterBalanceClosureSchema.parse(typeof row.closure === 'string' ? JSON.parse(row.closure) : row.closure),
  note: row.note,
  savedBy: row.saved_by_name,
  savedAt: new Date(row.saved_at).toISOString(),
});

/** Saved water-balance closures of a catchment; the newest is the "water-balance precipitation" scenarios can use. */
export class ClosureStore {
  async history(scope: TenantScope, catchmentId: number): Promise<SavedClosure[]> {
    const rows = await scope.from<ClosureRow>('water_balance_closures').where('catchment_id', catchmentId).orderBy([{ column: 'saved_at', order: 'desc' }, { column: 'id', order: 'desc' }]).limit(50);
    return rows.map(toSaved);
  }

  async current(scope: TenantScope, catchmentId: number): Promise<SavedClosure | null> {
    return (await this.history(scope, catchmentId))[0] ?? null;
  }

  async save(scope: TenantScope, user: UserRow, catchmentId: number, closure: WaterBalanceClosure, note: string): Promise<SavedClosure> {
    const id = await scope.insert('water_balance_closures', {
      catchment_id: catchmentId, period_from: closure.period.from, period_to: closure.period.to, closure: JSON.stringify(closure), note,
      saved_by: user.id, saved_by_name: user.name,
    });
    return toSaved(await scope.findOr404<ClosureRow>('water_balance_closures', id, 'Water balance'));
  }
}
