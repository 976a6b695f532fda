import { commonPeriod, stationClimate, type MonthAggregate } from '../../../shared/analysis/station-climatology';
import type { StationClimate } from '../../../shared/hydrology/stations';
import type { DatasetRow } from '../catchments/dataset-service';
import { expectedStepsInMonth, monthsBetween } from '../catchments/dataset-service';
import type { StationRow } from '../stations/station-rows';
import type { TenantScope } from '../tenant-scope';

type Period = { from: string; to: string };

/** A station's temperature record: hourly or daily means, or daily minimum and maximum. */
type TemperatureRecord = { kind: 'mean'; row: DatasetRow } | { kind: 'range'; min: DatasetRow; max: DatasetRow };

export interface StationClimatology {
  station: StationRow;
  climate: StationClimate;
}

export interface Climatologies {
  stations: StationClimatology[];
  periods: { temperature: Period | null; precipitation: Period | null };
  notes: string[];
}

const day = (t: string | null) => (t ?? '').slice(0, 10);
const span = (row: DatasetRow) => ({ first: day(row.first_at), last: day(row.last_at) });

function temperatureOf(rows: DatasetRow[]): TemperatureRecord | null {
  const newest = (variable: string, step?: string) => rows.find((r) => r.variable === variable && (!step || r.time_step === step) && r.first_at && r.last_at);
  const mean = newest('temperature', 'hourly') ?? newest('temperature');
  if (mean) return { kind: 'mean', row: mean };
  const min = newest('temperatureMin');
  const max = newest('temperatureMax');
  return min && max ? { kind: 'range', min, max } : null;
}

const spanOf = (t: TemperatureRecord) => (t.kind === 'mean' ? span(t.row) : { first: [day(t.min.first_at), day(t.max.first_at)].sort()[1], last: [day(t.min.last_at), day(t.max.last_at)].sort()[0] });

async function monthAggregates(scope: TenantScope, row: DatasetRow, period: Period): Promise<MonthAggregate[]> {
  const groups: { month: string; mean: number; total: number; count: number }[] = await scope.from('dataset_values')
    .where('dataset_id', row.id)
    .whereBetween('t', [`${period.from} 00:00`, `${period.to} 23:59`])
    .select(scope.db.raw("DATE_FORMAT(t, '%Y-%m') as month"), scope.db.raw('AVG(value) as mean'), scope.db.raw('SUM(value) as total'), scope.db.raw('COUNT(*) as count'))
    .groupBy('month');
  const byMonth = new Map(groups.map((g) => [g.month, g]));
  const first = `${period.from} 00:00`;
  const last = row.time_step === 'hourly' ? `${period.to} 23:00` : `${period.to} 00:00`;
  return monthsBetween(first, last).map((month) => {
    const g = byMonth.get(month);
    return { month, mean: Number(g?.mean ?? 0), total: Number(g?.total ?? 0), count: Number(g?.count ?? 0), expected: expectedStepsInMonth(month, first, last, row.time_step) };
  });
}

/** Daily minimum and maximum: the monthly mean is the mean of the two means (the daily-mean convention of FAO-56 Eq. 9). */
async function temperatureAggregates(scope: TenantScope, t: TemperatureRecord, period: Period): Promise<MonthAggregate[]> {
  if (t.kind === 'mean') return monthAggregates(scope, t.row, period);
  const [min, max] = await Promise.all([monthAggregates(scope, t.min, period), monthAggregates(scope, t.max, period)]);
  return min.map((m, i) => ({ ...m, mean: (m.mean + max[i].mean) / 2, count: Math.min(m.count, max[i].count) }));
}

/**
 * Every station's monthly climatology of temperature and precipitation over the period the
 * stations share for that variable (their common period), from the newest record of each. When
 * the records share no period, each station's own record is used, and the notes say so.
 */
export async function stationClimatologies(scope: TenantScope, catchmentId: number, stations: StationRow[]): Promise<Climatologies> {
  const rows: DatasetRow[] = await scope.from<DatasetRow>('datasets').where({ catchment_id: catchmentId, kind: 'climate' }).whereNotNull('station_id').orderBy('id', 'desc');
  const records = stations.map((station) => {
    const own = rows.filter((r) => r.station_id === station.id);
    return { station, temperature: temperatureOf(own), precipitation: own.find((r) => r.variable === 'precipitation' && r.first_at && r.last_at) ?? null };
  });
  const notes: string[] = [];
  const shared = (spans: { first: string; last: string }[], what: string): Period | null => {
    if (spans.length < 2) return spans.length === 1 ? { from: spans[0].first, to: spans[0].last } : null;
    const common = commonPeriod(spans);
    if (!common) notes.push(`The stations' ${what} records share no period, so each station's climatology covers its own record: differences between stations then mix climate with the years each covers.`);
    return common;
  };
  const temperaturePeriod = shared(records.flatMap((r) => (r.temperature ? [spanOf(r.temperature)] : [])), 'temperature');
  const precipitationPeriod = shared(records.flatMap((r) => (r.precipitation ? [span(r.precipitation)] : [])), 'precipitation');
  const result = await Promise.all(records.map(async (r) => {
    const tPeriod = r.temperature ? (temperaturePeriod ?? { from: spanOf(r.temperature).first, to: spanOf(r.temperature).last }) : null;
    const pPeriod = r.precipitation ? (precipitationPeriod ?? { from: span(r.precipitation).first, to: span(r.precipitation).last }) : null;
    const temperature = r.temperature && tPeriod ? await temperatureAggregates(scope, r.temperature, tPeriod) : null;
    const precipitation = r.precipitation && pPeriod ? await monthAggregates(scope, r.precipitation, pPeriod) : null;
    return { station: r.station, climate: stationClimate(r.station.name, r.station.elevation_m, temperature, precipitation) };
  }));
  return { stations: result, periods: { temperature: temperaturePeriod, precipitation: precipitationPeriod }, notes };
}
