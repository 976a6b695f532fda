import type { ChartData, ChartKey, TableData, TableKey } from '../../../shared/schemas/briefings';
import { chartTable } from '../../../shared/briefings/chart-table';
import type { BandMonthVolumes, ComparisonForBriefing, RunForBriefing } from './comparison';

const MILLION = 1e6;
const meltOf = (r: BandMonthVolumes) => r.snowMeltM3 + r.iceMeltM3 + r.debrisIceMeltM3;
const round = (x: number, digits: number) => Number(x.toFixed(digits));

/** Sum of `pick` per key over a run's band × month rows. */
function sumBy(run: RunForBriefing, key: (r: BandMonthVolumes) => string, pick: (r: BandMonthVolumes) => number): Map<string, number> {
  const out = new Map<string, number>();
  for (const row of run.bandMonths) out.set(key(row), (out.get(key(row)) ?? 0) + pick(row));
  return out;
}

function monthlyAddedMelt(c: ComparisonForBriefing): ChartData {
  const months = [...new Set(c.baseline.bandMonths.map((r) => r.month))].sort();
  const base = sumBy(c.baseline, (r) => r.month, meltOf);
  return {
    type: 'bar', xName: 'Month', yName: 'Added melt', unit: 'million m³', categories: months,
    series: c.variants.map((v) => {
      const variant = sumBy(v, (r) => r.month, meltOf);
      return { name: v.scenarioName, values: months.map((m) => round(((variant.get(m) ?? 0) - (base.get(m) ?? 0)) / MILLION, 4)) };
    }),
  };
}

function bandAddedMelt(c: ComparisonForBriefing): ChartData {
  const base = sumBy(c.baseline, (r) => String(r.bandIndex), meltOf);
  return {
    type: 'bar', xName: 'Elevation band', yName: 'Added melt', unit: 'mm w.e.', categories: c.bands.map((b) => b.label),
    series: c.variants.map((v) => {
      const variant = sumBy(v, (r) => String(r.bandIndex), meltOf);
      // m³ over km² → mm: 1 mm over 1 km² is 1000 m³.
      return { name: v.scenarioName, values: c.bands.map((b, i) => round(((variant.get(String(i)) ?? 0) - (base.get(String(i)) ?? 0)) / (b.areaKm2 * 1000), 1)) };
    }),
  };
}

const SURFACES = [['Snow', 'snowMeltM3'], ['Clean ice', 'iceMeltM3'], ['Debris-covered ice', 'debrisIceMeltM3']] as const;

function surfaceSplit(c: ComparisonForBriefing): ChartData {
  const total = (run: RunForBriefing, field: (typeof SURFACES)[number][1]) => run.bandMonths.reduce((s, r) => s + r[field], 0);
  return {
    type: 'bar', xName: 'Surface', yName: 'Added melt', unit: 'million m³', categories: SURFACES.map(([label]) => label),
    series: c.variants.map((v) => ({
      name: v.scenarioName,
      values: SURFACES.map(([, field]) => round((total(v, field) - total(c.baseline, field)) / MILLION, 4)),
    })),
  };
}

function dailyDischarge(c: ComparisonForBriefing): ChartData {
  const { startDate, dischargeM3s } = c.baseline.daily;
  const start = Date.parse(`${startDate}T00:00:00Z`);
  const dates = dischargeM3s.map((_, d) => new Date(start + d * 86_400_000).toISOString().slice(0, 10));
  const r3 = (xs: number[] | undefined) => xs?.map((x) => round(x, 3));
  return {
    type: 'line', xName: 'Date', yName: 'Discharge', unit: 'm³/s', categories: dates,
    series: [
      { name: `${c.baseline.scenarioName} (baseline)`, values: r3(dischargeM3s)! },
      ...c.variants.map((v) => ({
        name: v.scenarioName, values: r3(v.daily.dischargeM3s)!,
        ...(v.daily.low && v.daily.high ? { low: r3(v.daily.low), high: r3(v.daily.high) } : {}),
      })),
    ],
  };
}

function totalsTable(c: ComparisonForBriefing): TableData {
  const ranged = (r: { value: number; low: number | null; high: number | null }, scale = 1, digits = 3) =>
    [round(r.value / scale, digits), r.low === null ? null : round(r.low / scale, digits), r.high === null ? null : round(r.high / scale, digits)];
  return {
    columns: [
      { label: 'Variant', unit: '' },
      { label: 'Added melt volume', unit: 'million m³' }, { label: 'low (5 %)', unit: 'million m³' }, { label: 'high (95 %)', unit: 'million m³' },
      { label: 'Added discharge in the melt season', unit: 'm³/s' }, { label: 'low (5 %)', unit: 'm³/s' }, { label: 'high (95 %)', unit: 'm³/s' },
      { label: 'Share of seasonal runoff', unit: '%' }, { label: 'low (5 %)', unit: '%' }, { label: 'high (95 %)', unit: '%' },
      { label: 'Timing shift', unit: 'days' }, { label: 'low (5 %)', unit: 'days' }, { label: 'high (95 %)', unit: 'days' },
      { label: 'Melt season', unit: '' },
    ],
    rows: c.variants.map((v) => [
      v.scenarioName,
      ...ranged(v.headline.addedVolumeM3, MILLION),
      ...ranged(v.headline.addedMeltSeasonDischargeM3s),
      ...ranged(v.headline.shareOfSeasonalRunoffPct, 1, 2),
      ...ranged(v.headline.timingShiftDays, 1, 1),
      v.headline.meltSeason,
    ]),
  };
}

const CHARTS: Record<ChartKey, (c: ComparisonForBriefing) => ChartData> = {
  'monthly-added-melt': monthlyAddedMelt,
  'daily-discharge': dailyDischarge,
  'band-added-melt': bandAddedMelt,
  'surface-split': surfaceSplit,
};

const TABLES: Record<TableKey, (c: ComparisonForBriefing) => TableData> = {
  totals: totalsTable,
  'monthly-added-melt': (c) => chartTable(monthlyAddedMelt(c)),
  'band-added-melt': (c) => chartTable(bandAddedMelt(c)),
};

export const resultChart = (key: ChartKey, c: ComparisonForBriefing): ChartData => CHARTS[key](c);
export const resultTable = (key: TableKey, c: ComparisonForBriefing): TableData => TABLES[key](c);
