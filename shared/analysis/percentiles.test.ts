import { describe, expect, it } from 'vitest';
import { band5to95, percentile, seriesBand5to95 } from './percentiles';
import { seededRandom } from './random';

describe('percentiles (Hyndman & Fan 1996, definition 7)', () => {
  it('matches the definition-7 values of 1 … 10', () => {
    // R: quantile(1:10, c(.05, .25, .5, .95)) = 1.45, 3.25, 5.5, 9.55 (definition 7 is R's default) [computed].
    const x = [7, 3, 10, 1, 5, 2, 9, 4, 8, 6];
    expect(percentile(x, 5)).toBeCloseTo(1.45, 12);
    expect(percentile(x, 25)).toBeCloseTo(3.25, 12);
    expect(percentile(x, 50)).toBeCloseTo(5.5, 12);
    expect(percentile(x, 95)).toBeCloseTo(9.55, 12);
  });

  it('brackets the median between the 5th and 95th percentiles', () => {
    const random = seededRandom(9);
    const sample = Array.from({ length: 50 }, () => random() * 100 - 20);
    const band = band5to95(sample);
    expect(band.p5).toBeLessThanOrEqual(band.p50);
    expect(band.p50).toBeLessThanOrEqual(band.p95);
    expect(band.p5).toBeGreaterThanOrEqual(Math.min(...sample));
    expect(band.p95).toBeLessThanOrEqual(Math.max(...sample));
  });

  it('computes per-step bands of an ensemble of series', () => {
    const members = [[1, 10], [2, 20], [3, 30]];
    const band = seriesBand5to95(members);
    const expected = { p5: [1.1, 11], p50: [2, 20], p95: [2.9, 29] };
    for (const key of ['p5', 'p50', 'p95'] as const) {
      band[key].forEach((v, t) => expect(v).toBeCloseTo(expected[key][t], 12));
    }
  });

  it('refuses an empty sample and a percentile out of range', () => {
    expect(() => percentile([], 50)).toThrow(/empty/);
    expect(() => percentile([1], 101)).toThrow(/between 0 and 100/);
  });
});
