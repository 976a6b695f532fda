import { describe, expect, it } from 'vitest';
import { compareDailyRecords } from './record-comparison';

const day = (d: number) => `2024-01-${String(d).padStart(2, '0')}`;
const record = (values: (number | null)[]) => values.flatMap((v, i) => (v === null ? [] : [{ date: day(i + 1), value: v }]));

describe('comparing two overlapping records', () => {
  it('pairs only the days both hold and reports bias, correlation and RMS difference (hand-checked)', () => {
    // Common days 2–5: first 2, 4, 6, 8; second 3, 5, 8, 9. Differences 1, 1, 2, 1 → bias 1.25, RMS √(7/4).
    // Means 5 and 6.25; Σ(a−ā)(b−b̄) = (−3)(−3.25) + (−1)(−1.25) + (1)(1.75) + (3)(2.75) = 21; Σ(a−ā)² = 20; Σ(b−b̄)² = 22.75.
    const c = compareDailyRecords(record([1, 2, 4, 6, 8, null]), record([null, 3, 5, 8, 9, 10]));
    expect(c.commonPeriod).toEqual({ from: day(2), to: day(5) });
    expect(c.days).toBe(4);
    expect(c.bias).toBeCloseTo(1.25, 12);
    expect(c.rmsDifference).toBeCloseTo(Math.sqrt(7 / 4), 12);
    expect(c.correlation).toBeCloseTo(21 / Math.sqrt(20 * 22.75), 12);
  });
  it('says nothing about records that do not overlap, and no correlation of a constant record', () => {
    expect(compareDailyRecords(record([1, 2]), record([null, null, 3])).commonPeriod).toBeNull();
    expect(compareDailyRecords(record([1, 1, 1]), record([1, 2, 3])).correlation).toBeNull();
  });
});
