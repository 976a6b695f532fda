import { STAKE_VARIABLE, variableSpec, type Variable } from '../../../shared/schemas/dataset-variables';
import type { StakeReading } from '../../../shared/schemas/stakes';
import type { Dataset, MonthlySummary, Series } from '../../../shared/schemas/datasets';
import { notFound, validationFailed } from '../../errors';
import { stationOfCatchment } from '../stations/station-rows';
import { csvDocument } from '../../../shared/csv/csv-writing';
import { roundTo } from '../../../shared/text/numbers';
import { csvFile, type DownloadFile } from '../download-file';
import { parseTimestamp, STEP_MINUTES } from './csv/timestamps';
import { readDatasetValues, readStakeReadings } from './dataset-values';
import { stepsBetween, valuesOnGrid } from './series-grid';
import type { TenantScope } from '../tenant-scope';

export interface DatasetRow {
  id: number;
  organisation_id: number;
  catchment_id: number;
  station_id: number | null;
  /** From the stations join (datasetsWithStations). */
  station_name?: string | null;
  station_network?: string | null;
  variable: Variable;
  kind: 'climate' | 'observation';
  unit: string;
  original_unit: string;
  time_step: 'hourly' | 'daily';
  time_zone: string;
  source: string;
  accuracy: string;
  file_name: string;
  uploaded_by_name: string;
  first_at: string | null;
  last_at: string | null;
  value_count: number;
  created_at: Date;
}

export function toDataset(row: DatasetRow): Dataset {
  // Stake readings cover irregular periods, so they have no expected count and are complete as read.
  const expected = row.variable === STAKE_VARIABLE ? row.value_count : row.first_at && row.last_at ? stepsBetween(row.first_at, row.last_at, row.time_step) : 0;
  const shorten = (t: string | null) => (t && row.time_step === 'daily' ? t.slice(0, 10) : t);
  return {
    id: row.id,
    catchmentId: row.catchment_id,
    stationId: row.station_id ?? null,
    stationName: row.station_name ?? null,
    variable: row.variable,
    kind: row.kind,
    unit: row.unit,
    originalUnit: row.original_unit,
    timeStep: row.time_step,
    timeZone: row.time_zone,
    source: row.source,
    accuracy: row.accuracy,
    fileName: row.file_name,
    uploadedBy: row.uploaded_by_name,
    createdAt: new Date(row.created_at).toISOString(),
    first: shorten(row.first_at),
    last: shorten(row.last_at),
    valueCount: row.value_count,
    completeness: expected > 0 ? row.value_count / expected : 0,
  };
}

/** The organisation's datasets with the name of the station each belongs to. */
export function datasetsWithStations(scope: TenantScope) {
  return scope.from<DatasetRow>('datasets').leftJoin('stations', 'stations.id', 'datasets.station_id').select('datasets.*', 'stations.name as station_name', 'stations.network as station_network');
}

/** Stored series of a catchment: list, values on a regular grid, monthly summary, CSV, station, delete. */
export class DatasetService {
  async list(scope: TenantScope, catchmentId: number): Promise<Dataset[]> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    const rows = await datasetsWithStations(scope).where('datasets.catchment_id', catchmentId).orderBy(['datasets.kind', 'datasets.variable', 'datasets.id']);
    return rows.map(toDataset);
  }

  async row(scope: TenantScope, catchmentId: number, datasetId: number): Promise<DatasetRow> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    const row = await datasetsWithStations(scope).where('datasets.id', datasetId).first();
    if (!row || row.catchment_id !== catchmentId) throw notFound('Dataset');
    return row;
  }

  /**
   * Moves a dataset to another station of the catchment (a series uploaded under the wrong one).
   * Climate series always belong to a station; observations may belong to none.
   */
  async assignStation(scope: TenantScope, catchmentId: number, datasetId: number, stationId: number | null): Promise<Dataset> {
    const row = await this.row(scope, catchmentId, datasetId);
    if (stationId === null && row.kind === 'climate') throw validationFailed('A climate series belongs to the station that recorded it; choose one.', 'stationId');
    if (stationId !== null) await stationOfCatchment(scope, catchmentId, stationId);
    await scope.from('datasets').where('id', datasetId).update({ station_id: stationId });
    return toDataset(await this.row(scope, catchmentId, datasetId));
  }

  async series(scope: TenantScope, catchmentId: number, datasetId: number): Promise<Series> {
    const row = await this.row(scope, catchmentId, datasetId);
    if (!row.first_at || !row.last_at) return { dataset: toDataset(row), times: [], values: [] };
    const values = await readDatasetValues(scope.db, { datasetId, organisationId: scope.organisationId });
    return { dataset: toDataset(row), ...valuesOnGrid(values, row.time_step, row.first_at, row.last_at) };
  }

  /** Per calendar month: mean (or total for precipitation), values held, steps expected within the record. */
  async monthly(scope: TenantScope, catchmentId: number, datasetId: number): Promise<MonthlySummary> {
    const row = await this.row(scope, catchmentId, datasetId);
    if (!row.first_at || !row.last_at) return { months: [] };
    const statistic = variableSpec(row.variable).monthly;
    const groups: { month: string; mean: number; total: number; count: number }[] = await scope
      .from('dataset_values')
      .where('dataset_id', datasetId)
      .select(scope.db.raw("DATE_FORMAT(t, '%Y-%m') as month"), scope.db.raw('AVG(value) as mean'), scope.db.raw('SUM(value) as total'), scope.db.raw('COUNT(*) as count'))
      .groupBy('month')
      .orderBy('month');
    const byMonth = new Map(groups.map((g) => [g.month, g]));
    return {
      months: monthsBetween(row.first_at, row.last_at).map((month) => {
        const g = byMonth.get(month);
        const expected = expectedStepsInMonth(month, row.first_at!, row.last_at!, row.time_step);
        const count = Number(g?.count ?? 0);
        const value = g ? Number(statistic === 'mean' ? g.mean : g.total) : null;
        return { month, value: value === null ? null : roundTo(value, 2), statistic, count, expected, completeness: expected > 0 ? count / expected : 0 };
      }),
    };
  }

  async stakeReadings(scope: TenantScope, catchmentId: number, datasetId: number): Promise<StakeReading[]> {
    const row = await this.row(scope, catchmentId, datasetId);
    return row.variable === STAKE_VARIABLE ? readStakeReadings(scope.db, { datasetId, organisationId: scope.organisationId }) : [];
  }

  async csvFile(scope: TenantScope, catchmentId: number, datasetId: number): Promise<DownloadFile> {
    const row = await this.row(scope, catchmentId, datasetId);
    const fileName = `${row.variable}-${row.id}.csv`;
    if (row.variable === STAKE_VARIABLE) {
      const readings = await readStakeReadings(scope.db, { datasetId, organisationId: scope.organisationId });
      return csvFile(fileName, csvDocument(['stake', 'elevation_m', 'from', 'to', 'balance_m_we'], readings.map((r) => [r.stake, r.elevationM, r.from, r.to, r.balanceMWe])));
    }
    const values = await readDatasetValues(scope.db, { datasetId, organisationId: scope.organisationId });
    const time = row.time_step === 'daily' ? (t: string) => t.slice(0, 10) : (t: string) => t;
    const header = [row.time_step === 'daily' ? 'date' : 'time', `${row.variable} (${row.unit})`];
    return csvFile(fileName, csvDocument(header, values.map((v) => [time(v.t), v.value])));
  }

  async remove(scope: TenantScope, catchmentId: number, datasetId: number): Promise<void> {
    await this.row(scope, catchmentId, datasetId);
    await scope.transaction(async (s) => {
      await s.from('dataset_values').where('dataset_id', datasetId).delete();
      await s.from('stake_readings').where('dataset_id', datasetId).delete();
      await s.from('datasets').where('id', datasetId).delete();
    });
  }
}

export function monthsBetween(first: string, last: string): string[] {
  const months: string[] = [];
  let [y, m] = first.slice(0, 7).split('-').map(Number);
  const end = last.slice(0, 7);
  for (;;) {
    const month = `${y}-${String(m).padStart(2, '0')}`;
    months.push(month);
    if (month >= end) return months;
    m += 1;
    if (m > 12) { m = 1; y += 1; }
  }
}

export function expectedStepsInMonth(month: string, first: string, last: string, step: 'hourly' | 'daily'): number {
  const [y, m] = month.split('-').map(Number);
  const size = STEP_MINUTES[step];
  const monthStart = Date.UTC(y, m - 1, 1) / 60_000;
  const monthEnd = Date.UTC(y, m, 1) / 60_000 - size;
  const from = Math.max(monthStart, parseTimestamp(first)!);
  const to = Math.min(monthEnd, parseTimestamp(last)!);
  return to < from ? 0 : Math.round((to - from) / size) + 1;
}
