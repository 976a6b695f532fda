import { describe, expect, it } from 'vitest';
import type { ResultItem } from './chart-spec';
import { cumulativeAdded, hydrograph } from './result-season-charts';

/** The parts of a run's results the season charts read. */
const item = (label: string, startDate: string, days: number): ResultItem => ({
  label,
  results: {
    startDate, dayCount: days, ensemble: null,
    dischargeM3s: { baseline: Array.from({ length: days }, () => 1), variant: Array.from({ length: days }, () => 2) },
    cumulativeAddedM3: Array.from({ length: days }, (_, d) => d * 86_400),
  },
}) as unknown as ResultItem;

describe('season charts comparing runs', () => {
  it('leave gaps, not errors, where a compared run of a shorter period has no day', () => {
    const items = [item('Long', '2024-04-01', 5), item('Short', '2022-05-01', 3)];
    expect(hydrograph(items).table.rows[4]).toMatchObject({ baseline: 1, v0: 2, v1: null });
    expect(cumulativeAdded(items).table.rows[4]).toMatchObject({ v0: 345_600, v1: null });
  });

  it('write the days along the axis and in the tooltip as dates, while the table keeps them as ISO days', () => {
    const { option, table } = hydrograph([item('Soot', '2024-04-01', 3)]);
    const x = option.xAxis as { data: string[]; axisLabel: { formatter(v: string): string }; axisPointer: { label: { formatter(p: { value: string }): string } } };
    expect(x.data[0]).toBe('2024-04-01');
    expect(x.axisLabel.formatter(x.data[0])).toBe('1 Apr 2024');
    expect(x.axisPointer.label.formatter({ value: x.data[2] })).toBe('3 Apr 2024');
    expect(Object.values(table.rows[0])).toContain('2024-04-01');
  });
});
