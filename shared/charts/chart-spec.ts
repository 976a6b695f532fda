import type { RunResults } from '../schemas/results';
import { withoutNoise } from '../text/format';
import { CATEGORY_POINTER, categoryLabel, chartValue } from './chart-style';
import { roundSignificant } from '../text/numbers';

/** The numbers of a chart as a table: its table view and CSV download. */
export interface ChartTable {
  columns: { name: string; label: string }[];
  rows: Record<string, string | number | null>[];
}

/** An ECharts option (plain data, no DOM) and the same numbers as a table. */
export interface ChartSpec {
  option: Record<string, unknown>;
  table: ChartTable;
}

/** One run on the results screen, with the name it is shown under. */
export interface ResultItem {
  label: string;
  results: RunResults;
}

/**
 * Axis settings with the name (and unit) of the axis always shown; numbers as everywhere else on
 * a value axis, days written as dates on a category axis and in its tooltip heading.
 */
export const axis = (name: string, type: 'category' | 'value', data?: string[]) => ({
  type, name, nameLocation: 'middle', nameGap: type === 'value' ? 60 : 30, ...(data ? { data } : {}),
  ...(type === 'value'
    ? { axisLabel: { formatter: chartValue } }
    : { axisLabel: { formatter: categoryLabel }, axisPointer: CATEGORY_POINTER }),
});

export const GRID = { left: 80, right: 24, top: 56, bottom: 70 };
/** A legend that wraps onto more lines instead of paging (grid.top 56 leaves room for two rows). */
export const LEGEND = { type: 'plain', top: 0, left: 'center', width: '92%' };
export const ZOOM = [{ type: 'inside' }, { type: 'slider', height: 16, bottom: 8 }];

/**
 * What a chart keeps of long model output: six significant digits; null, and a day or month one of
 * the runs compared does not have (runs of different periods), stay a gap.
 */
export const chartNumber = (value: number | null | undefined): number | null => (value === null || value === undefined ? null : roundSignificant(withoutNoise(value), 6) || 0);

/**
 * A text description of a chart for assistive technology: what runs along it and what it shows,
 * e.g. "Day from 2024-05-01 to 2024-09-30 (153 rows); shows Baseline (m³/s), Variant (m³/s). The table view lists every value."
 */
export function describeChartTable(table: ChartTable): string {
  const [first, ...rest] = table.columns;
  if (!first || table.rows.length === 0) return 'No values to show yet.';
  const from = table.rows[0][first.name];
  const to = table.rows[table.rows.length - 1][first.name];
  const range = table.rows.length > 1 ? `from ${from} to ${to}` : `${from}`;
  const shown = rest.length ? `; shows ${rest.map((c) => c.label).join(', ')}` : '';
  return `${first.label} ${range} (${table.rows.length} rows)${shown}. The table view lists every value.`;
}
