import type { RunResults } from '@shared/schemas/results';
import type { ChartTable } from '../BaseChart.vue';

/** One run on the results screen, with the name it is shown under. */
export interface ResultItem {
  label: string;
  results: RunResults;
}

export interface ChartSpec {
  option: Record<string, unknown>;
  table: ChartTable;
}

export const round = (v: number | null, digits = 3) => (v === null ? null : Number(v.toPrecision(digits + 3)));

/** Axis settings with the name (and unit) of the axis always shown. */
export const axis = (name: string, type: 'category' | 'value', data?: string[]) => ({
  type, name, nameLocation: 'middle', nameGap: type === 'value' ? 60 : 30, ...(data ? { data } : {}),
});

export const GRID = { left: 80, right: 24, top: 56, bottom: 70 };
export const TOOLTIP = { trigger: 'axis' };
export const LEGEND = { top: 0, type: 'scroll' };
export const ZOOM = [{ type: 'inside' }, { type: 'slider', height: 16, bottom: 8 }];
