import type { ChartData, TableData } from '../schemas/briefings';

/** The table view of a chart: one row per category, one column per series (and its range). */
export function chartTable(chart: ChartData): TableData {
  const columns = [{ label: chart.xName, unit: '' }];
  const pickers: ((row: number) => number | null)[] = [];
  for (const s of chart.series) {
    columns.push({ label: s.name, unit: chart.unit });
    pickers.push((r) => s.values[r] ?? null);
    if (s.low && s.high) {
      const { low, high } = s;
      columns.push({ label: `${s.name} 5 %`, unit: chart.unit }, { label: `${s.name} 95 %`, unit: chart.unit });
      pickers.push((r) => low[r] ?? null, (r) => high[r] ?? null);
    }
  }
  const rows = chart.categories.map((category, r) => [category, ...pickers.map((pick) => pick(r))]);
  return { columns, rows };
}
