import { describe, expect, it } from 'vitest';
import { DELTA_H_COEFFICIENTS, glacierSizeClass, normalisedThinning } from './delta-h';

/**
 * The published normalised thinning curves of Huss et al. 2010 (HESS 14:815, Eq. 2 and the
 * coefficients for large, medium and small glaciers [memory]), evaluated by hand [computed]:
 *   large  (γ 6, a −0.02, b 0.12, c 0):    hr 0.25 → 0.0277, 0.5 → 0.0698, 0.75 → 0.2389, 1 → 1.0034 (clipped to 1)
 *   medium (γ 4, a −0.05, b 0.19, c 0.01): hr 0.25 → 0.0496, 0.5 → 0.1365, 0.75 → 0.3831, 1 → 1.0050 (clipped to 1)
 *   small  (γ 2, a −0.30, b 0.60, c 0.09): hr² exactly, since (hr − 0.3)² + 0.6 (hr − 0.3) + 0.09 = hr²
 * Tolerance 5·10⁻⁵ (the hand values are rounded to four decimals).
 */
const table: [string, number, number][] = [
  ['large', 0.25, 0.0277], ['large', 0.5, 0.0698], ['large', 0.75, 0.2389], ['large', 1, 1],
  ['medium', 0.25, 0.0496], ['medium', 0.5, 0.1365], ['medium', 0.75, 0.3831], ['medium', 1, 1],
  ['small', 0.25, 0.0625], ['small', 0.5, 0.25], ['small', 0.75, 0.5625], ['small', 1, 1],
];

describe('Δh curves (Huss et al. 2010)', () => {
  it.each(table)('%s glaciers: Δh(%f) = %f', (size, hr, expected) => {
    expect(Math.abs(normalisedThinning(hr, size as 'large') - expected)).toBeLessThan(5e-5);
  });

  it('each curve is ≈ 0 at the top and ≈ 1 at the terminus before clipping (the normalisation of the published curves)', () => {
    for (const { a, b, c, gamma } of Object.values(DELTA_H_COEFFICIENTS)) {
      const raw = (hr: number) => Math.pow(hr + a, gamma) + b * (hr + a) + c;
      expect(Math.abs(raw(0))).toBeLessThan(0.003);
      expect(Math.abs(raw(1) - 1)).toBeLessThan(0.006);
    }
  });

  it('large glaciers concentrate thinning at the tongue, small ones spread it: at mid-range large < medium < small', () => {
    expect(normalisedThinning(0.5, 'large')).toBeLessThan(normalisedThinning(0.5, 'medium'));
    expect(normalisedThinning(0.5, 'medium')).toBeLessThan(normalisedThinning(0.5, 'small'));
  });

  it('every curve rises from the top to the terminus', () => {
    for (const size of ['large', 'medium', 'small'] as const) {
      const values = Array.from({ length: 21 }, (_, i) => normalisedThinning(i / 20, size));
      for (let i = 1; i < values.length; i++) expect(values[i]).toBeGreaterThanOrEqual(values[i - 1]);
    }
  });

  it('size classes: < 5 km² small, 5–20 km² medium, > 20 km² large', () => {
    expect([1, 4.99, 5, 20, 20.1].map(glacierSizeClass)).toEqual(['small', 'small', 'medium', 'medium', 'large']);
    expect(() => normalisedThinning(1.2, 'small')).toThrow(/outside 0 … 1/);
  });
});
