import { compareDailyRecords, type DailyValue } from '../../../shared/analysis/record-comparison';
import { variableSpec, type Variable } from '../../../shared/schemas/dataset-variables';
import type { StationComparison } from '../../../shared/schemas/stations';
import { validationFailed } from '../../errors';
import type { DatasetRow, DatasetService } from '../catchments/dataset-service';
import type { TenantScope } from '../tenant-scope';

/** Hours a day of an hourly record must hold to count as a day (at most four missing). */
const MIN_HOURS = 20;

/**
 * Two records of one variable (usually from two stations or networks) compared day by day over
 * the days both hold: nothing is filled or merged, each keeps its own provenance and accuracy.
 */
export class StationComparisonService {
  constructor(private readonly datasets: DatasetService) {}

  async compare(scope: TenantScope, catchmentId: number, firstId: number, secondId: number): Promise<StationComparison> {
    const first = await this.datasets.row(scope, catchmentId, firstId);
    const second = await this.datasets.row(scope, catchmentId, secondId);
    if (first.variable !== second.variable) {
      throw validationFailed(`second: the records hold different variables (${variableSpec(first.variable).label} and ${variableSpec(second.variable).label}); compare records of one variable.`, 'second');
    }
    const spec = variableSpec(first.variable as Variable);
    if (spec.kind !== 'climate' && first.variable !== 'discharge') throw validationFailed('second: stake readings are compared in the lab, not day by day.', 'second');
    const [a, b] = await Promise.all([dailyValues(scope, first, spec.monthly), dailyValues(scope, second, spec.monthly)]);
    const c = compareDailyRecords(a, b);
    const notes: string[] = [];
    if (c.days === 0) notes.push('The two records have no day in common.');
    else if (c.days < 30) notes.push(`Only ${c.days} common days: too few to say much about a bias.`);
    if (first.time_zone !== second.time_zone) notes.push(`The records are kept in different time zones (${first.time_zone} and ${second.time_zone}); days are compared as written.`);
    notes.push('The records are compared, not merged: each keeps its own values, provenance and stated accuracy.');
    return {
      variable: first.variable, variableLabel: spec.label, unit: spec.storedUnit, statistic: spec.monthly,
      first: describe(first), second: describe(second), ...c, notes,
    };
  }
}

function describe(row: DatasetRow) {
  return {
    datasetId: row.id, stationName: row.station_name ?? 'no station', network: row.station_network ?? '', source: row.source, accuracy: row.accuracy,
    first: row.first_at?.slice(0, 10) ?? null, last: row.last_at?.slice(0, 10) ?? null,
  };
}

async function dailyValues(scope: TenantScope, row: DatasetRow, statistic: 'mean' | 'total'): Promise<DailyValue[]> {
  const groups: { date: string; mean: number; total: number; n: number }[] = await scope.from('dataset_values')
    .where('dataset_id', row.id)
    .select(scope.db.raw("DATE_FORMAT(t, '%Y-%m-%d') as date"), scope.db.raw('AVG(value) as mean'), scope.db.raw('SUM(value) as total'), scope.db.raw('COUNT(*) as n'))
    .groupBy('date')
    .orderBy('date');
  const needed = row.time_step === 'hourly' ? MIN_HOURS : 1;
  return groups.filter((g) => Number(g.n) >= needed).map((g) => ({
    date: g.date,
    // A day's total from an hourly record with a few hours missing is scaled to 24 hours.
    value: statistic === 'mean' ? Number(g.mean) : row.time_step === 'hourly' ? (Number(g.total) * 24) / Number(g.n) : Number(g.total),
  }));
}
