import { describe, expect, it } from 'vitest';
import { samePeriodAsFirst } from './compare-periods';

const item = (label: string, startDate: string, dayCount: number) => ({ label, results: { startDate, dayCount } });

describe('samePeriodAsFirst', () => {
  it('keeps the runs over the first one\'s days and lists the rest', () => {
    const a = item('a', '2024-04-01', 183);
    const b = item('b', '2022-05-01', 153);
    const c = item('c', '2024-04-01', 183);
    const d = item('d', '2024-04-01', 150);
    expect(samePeriodAsFirst([a, b, c, d])).toEqual({ kept: [a, c], left: [b, d] });
    expect(samePeriodAsFirst([])).toEqual({ kept: [], left: [] });
  });
});
