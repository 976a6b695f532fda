import { describe, expect, it } from 'vitest';
import { comparePeakWater, movingMean, peakWater } from './peak-water';

const years = (from: number, n: number) => Array.from({ length: n }, (_, i) => from + i);

describe('peak water from annual glacier runoff (11-year moving mean, Huss & Hock 2018 [memory])', () => {
  it('moving mean, hand-worked: window 3 over 1 … 5 → NaN, 2, 3, 4, NaN', () => {
    expect(Array.from(movingMean([1, 2, 3, 4, 5], 3))).toEqual([Number.NaN, 2, 3, 4, Number.NaN]);
    expect(() => movingMean([1], 4)).toThrow(/odd/);
  });

  it('finds the year of a known peak: runoff rising to 2052 and falling after', () => {
    const ys = years(2020, 81);
    const runoff = ys.map((y) => 100 - Math.abs(y - 2052) + 3 * Math.sin(y));
    const peak = peakWater(ys, runoff);
    expect(peak.status).toBe('reached');
    expect(Math.abs(peak.year! - 2052)).toBeLessThanOrEqual(1);
  });

  it('says when the peak lies at the start or is not reached by the end', () => {
    const ys = years(2020, 40);
    expect(peakWater(ys, ys.map((y) => -y)).status).toBe('at or before the start');
    expect(peakWater(ys, ys.map((y) => y)).status).toBe('not reached');
    expect(peakWater(years(2020, 8), Array(8).fill(1)).status).toBe('too short');
  });

  it('gives each variant its shift against the baseline', () => {
    const ys = years(2020, 81);
    const result = comparePeakWater(ys, ys.map((y) => -Math.abs(y - 2060)), { darker: ys.map((y) => -Math.abs(y - 2048)) });
    expect(result.variants.darker.shiftYears).toBe(-12);
  });

  it('refuses years that skip and mismatched lengths', () => {
    expect(() => peakWater([2020, 2022], [1, 2])).toThrow(/^years\[1\]: the years must follow one another/);
    expect(() => peakWater([2020, 2021], [1])).toThrow(/^glacierRunoff/);
  });
});
