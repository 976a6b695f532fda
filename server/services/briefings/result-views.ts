import type { ChartData, ChartKey, Headline, Ranged, TableData, TableKey } from '../../../shared/schemas/briefings';
import type { RunResults } from '../../../shared/schemas/results';
import { chartTable } from '../../../shared/briefings/chart-table';
import { formatNumber, roundTo } from '../../../shared/text/numbers';
import type { ComparisonForBriefing } from './comparison';

const MILLION = 1e6;
const dateOf = (start: string, day: number) => new Date(Date.parse(`${start}T00:00:00Z`) + day * 86_400_000).toISOString().slice(0, 10);
const bandLabel = (b: { elevationM: number }) => `${formatNumber(b.elevationM, 0)} m`;
const variantsOf = (c: ComparisonForBriefing) => c.runs.map((r) => r.results);

/** Added runoff per calendar month (variant minus baseline daily discharge), million m³. */
function monthlyAdded(c: ComparisonForBriefing): ChartData {
  const first = c.runs[0].results;
  const months = [...new Set(Array.from({ length: first.dayCount }, (_, d) => dateOf(first.startDate, d).slice(0, 7)))];
  return {
    type: 'bar', xName: 'Month', yName: 'Added runoff', unit: 'million m³', categories: months,
    series: variantsOf(c).map((r) => {
      const perMonth = new Map<string, number>();
      r.dischargeM3s.variant.forEach((q, d) => {
        const month = dateOf(r.startDate, d).slice(0, 7);
        perMonth.set(month, (perMonth.get(month) ?? 0) + (q - r.dischargeM3s.baseline[d]) * 86400);
      });
      return { name: r.run.scenarioName, values: months.map((m) => roundTo((perMonth.get(m) ?? 0) / MILLION, 4)) };
    }),
  };
}

function bandAddedMelt(c: ComparisonForBriefing): ChartData {
  return {
    type: 'bar', xName: 'Elevation band (mean elevation)', yName: 'Added melt', unit: 'mm w.e.', categories: c.runs[0].results.bands.map(bandLabel),
    series: variantsOf(c).map((r) => ({ name: r.run.scenarioName, values: r.bandAddedMm.map((b) => roundTo(b.snow + b.ice + b.debrisIce, 1)) })),
  };
}

const SURFACES = [['Snow', 'snow'], ['Clean ice', 'ice'], ['Debris-covered ice', 'debrisIce']] as const;

function surfaceSplit(c: ComparisonForBriefing): ChartData {
  return {
    type: 'bar', xName: 'Surface', yName: 'Added melt', unit: 'million m³', categories: SURFACES.map(([label]) => label),
    series: variantsOf(c).map((r) => ({
      name: r.run.scenarioName,
      // mm over m² → m³: divide by 1000.
      values: SURFACES.map(([, source]) => roundTo(r.bandAddedMm.reduce((s, b, i) => s + (b[source] * r.bands[i].areaM2) / 1000, 0) / MILLION, 4)),
    })),
  };
}

function dailyDischarge(c: ComparisonForBriefing): ChartData {
  const first = c.runs[0].results;
  const r3 = (xs: number[]) => xs.map((x) => roundTo(x, 3));
  return {
    type: 'line', xName: 'Date', yName: 'Discharge', unit: 'm³/s',
    categories: Array.from({ length: first.dayCount }, (_, d) => dateOf(first.startDate, d)),
    series: [
      { name: `${c.baselineName} (baseline)`, values: r3(first.dischargeM3s.baseline) },
      ...variantsOf(c).map((r) => ({
        name: r.run.scenarioName, values: r3(r.dischargeM3s.variant),
        ...(r.ensemble ? { low: r3(r.ensemble.dischargeM3s.p5), high: r3(r.ensemble.dischargeM3s.p95) } : {}),
      })),
    ],
  };
}

/** A total with its ensemble 5–95 % range, scaled. */
function ranged(r: RunResults, key: 'addedVolumeM3' | 'meanAddedDischargeM3s' | 'addedShareOfBaselineRunoff' | 'timingShiftDays', scale = 1): Ranged {
  const value = r.totals[key];
  const band = r.ensemble?.totals[key];
  return { value: value === null ? null : value * scale, low: band ? band.p5 * scale : null, high: band ? band.p95 * scale : null };
}

export function headlineOf(r: RunResults): Headline {
  const season = r.totals.meltSeason;
  return {
    variantName: r.run.scenarioName,
    addedVolumeM3: ranged(r, 'addedVolumeM3'),
    addedMeltSeasonDischargeM3s: ranged(r, 'meanAddedDischargeM3s'),
    addedRunoffPercentOfBaseline: ranged(r, 'addedShareOfBaselineRunoff', 100),
    timingShiftDays: ranged(r, 'timingShiftDays'),
    meltSeason: season ? `${season.from} to ${season.to}` : 'no melt season found',
  };
}

function totalsTable(c: ComparisonForBriefing): TableData {
  const cells = (r: Ranged, scale: number, digits: number) => [r.value, r.low, r.high].map((x) => (x === null ? null : roundTo(x / scale, digits)));
  const trio = (label: string, unit: string) => [{ label, unit }, { label: 'low (5 %)', unit }, { label: 'high (95 %)', unit }];
  return {
    columns: [
      { label: 'Variant', unit: '' },
      ...trio('Added melt volume', 'million m³'), ...trio('Added discharge in the melt season', 'm³/s'),
      ...trio('Added runoff, % of baseline', '%'), ...trio('Timing shift', 'days'),
      { label: 'Melt season', unit: '' },
    ],
    rows: variantsOf(c).map(headlineOf).map((h) => [
      h.variantName,
      ...cells(h.addedVolumeM3, MILLION, 3), ...cells(h.addedMeltSeasonDischargeM3s, 1, 3),
      ...cells(h.addedRunoffPercentOfBaseline, 1, 2), ...cells(h.timingShiftDays, 1, 1),
      h.meltSeason,
    ]),
  };
}

const CHARTS: Record<ChartKey, (c: ComparisonForBriefing) => ChartData> = {
  'monthly-added-melt': monthlyAdded,
  'daily-discharge': dailyDischarge,
  'band-added-melt': bandAddedMelt,
  'surface-split': surfaceSplit,
};

const TABLES: Record<TableKey, (c: ComparisonForBriefing) => TableData> = {
  totals: totalsTable,
  'monthly-added-melt': (c) => chartTable(monthlyAdded(c)),
  'band-added-melt': (c) => chartTable(bandAddedMelt(c)),
};

export const resultChart = (key: ChartKey, c: ComparisonForBriefing): ChartData => CHARTS[key](c);
export const resultTable = (key: TableKey, c: ComparisonForBriefing): TableData => TABLES[key](c);
