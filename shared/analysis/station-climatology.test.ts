import { describe, expect, it } from 'vitest';
import { commonPeriod, monthlyClimatology } from './station-climatology';

describe('station climatologies', () => {
  it('average complete months over the years and leave out months held too sparsely (hand-checked)', () => {
    const months = [
      { month: '2022-01', mean: -8, total: 40, count: 31, expected: 31 },
      { month: '2023-01', mean: -6, total: 60, count: 30, expected: 31 },
      { month: '2024-01', mean: -20, total: 5, count: 10, expected: 31 },
      { month: '2023-07', mean: 9, total: 120, count: 27, expected: 31 },
    ];
    const t = monthlyClimatology(months, 'mean');
    expect(t[0]).toBe(-7);
    expect(t[6]).toBe(9); // 27/31 = 0.87 ≥ 0.8 counts for a mean
    expect(t[1]).toBeNull();
    const p = monthlyClimatology(months, 'total');
    expect(p[0]).toBe(50);
    expect(p[6]).toBeNull(); // but 0.87 < 0.9 is too sparse for a total
  });
  it('compare stations over the period they share, or say they share none', () => {
    expect(commonPeriod([{ first: '2021-10-01', last: '2024-09-30' }, { first: '2022-06-01', last: '2025-01-01' }])).toEqual({ from: '2022-06-01', to: '2024-09-30' });
    expect(commonPeriod([{ first: '2021-01-01', last: '2021-12-31' }, { first: '2022-01-01', last: '2022-12-31' }])).toBeNull();
  });
});
