import type { CalibrationSet } from '../../../shared/lab/calibration-set';
import type { SavedCalibration } from '../../../shared/schemas/lab';
import type { UserRow } from '../auth/auth-service';
import type { TenantScope } from '../tenant-scope';

interface CalibrationRow {
  id: number;
  catchment_id: number;
  parameters: string | Record<string, number>;
  precipitation_factor: number;
  period_from: string | Date;
  period_to: string | Date;
  scores: string | SavedCalibration['scores'];
  note: string;
  saved_by_name: string;
  saved_at: Date;
}

const json = <T>(value: string | T): T => (typeof value === 'string' ? (JSON.parse(value) as T) : value);
const day = (value: string | Date) => (value instanceof Date ? value.toISOString().slice(0, 10) : String(value).slice(0, 10));

function toSaved(row: CalibrationRow): SavedCalibration {
  return {
    id: row.id,
    set: { parameters: json(row.parameters), precipitationFactor: row.precipitation_factor },
    period: { from: day(row.period_from), to: day(row.period_to) },
    scores: json(row.scores),
    note: row.note,
    savedBy: row.saved_by_name,
    savedAt: new Date(row.saved_at).toISOString(),
  };
}

/** Saved calibrations of a catchment; the newest is the set in force. */
export class CalibrationStore {
  async history(scope: TenantScope, catchmentId: number): Promise<SavedCalibration[]> {
    const rows = await scope.from<CalibrationRow>('calibrated_parameters').where('catchment_id', catchmentId).orderBy([{ column: 'saved_at', order: 'desc' }, { column: 'id', order: 'desc' }]).limit(50);
    return rows.map(toSaved);
  }

  async current(scope: TenantScope, catchmentId: number): Promise<SavedCalibration | null> {
    const row = await scope.from<CalibrationRow>('calibrated_parameters').where('catchment_id', catchmentId).orderBy([{ column: 'saved_at', order: 'desc' }, { column: 'id', order: 'desc' }]).first();
    return row ? toSaved(row) : null;
  }

  async save(scope: TenantScope, user: UserRow, catchmentId: number, entry: { set: CalibrationSet; period: { from: string; to: string }; scores: SavedCalibration['scores']; note: string }): Promise<SavedCalibration> {
    const id = await scope.insert('calibrated_parameters', {
      catchment_id: catchmentId,
      parameters: JSON.stringify(entry.set.parameters),
      precipitation_factor: entry.set.precipitationFactor,
      period_from: entry.period.from,
      period_to: entry.period.to,
      scores: JSON.stringify(entry.scores),
      note: entry.note,
      saved_by: user.id,
      saved_by_name: user.name,
    });
    const row = await scope.findOr404<CalibrationRow>('calibrated_parameters', id, 'Calibration');
    return toSaved(row);
  }
}
