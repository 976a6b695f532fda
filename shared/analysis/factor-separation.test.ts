import { describe, expect, it } from 'vitest';
import { bitCount, separateFactors } from './factor-separation';

describe('factor separation (Stein & Alpert 1993)', () => {
  it('gives pure contributions and the interaction for two factors', () => {
    // Stein & Alpert 1993 Eq. for two factors: f̂1 = f1 − f0, f̂2 = f2 − f0, f̂12 = f12 − (f1 + f2) + f0.
    expect(separateFactors([10, 13, 15, 19], 2)).toEqual([
      { mask: 1, value: 3 }, { mask: 2, value: 5 }, { mask: 3, value: 1 },
    ]);
  });

  it('has all terms add up to the full change for any response, N = 1 … 5', () => {
    for (let n = 1; n <= 5; n++) {
      // A strongly non-linear response so every interaction term is non-zero.
      const values = Array.from({ length: 1 << n }, (_, mask) => Math.exp(0.3 * bitCount(mask)) + Math.sin(mask) * mask);
      const terms = separateFactors(values, n);
      expect(terms).toHaveLength((1 << n) - 1);
      const total = terms.reduce((a, t) => a + t.value, 0);
      expect(total).toBeCloseTo(values[(1 << n) - 1] - values[0], 10);
    }
  });

  it('finds no interaction when factors act additively', () => {
    const effect = [2, -1, 4];
    const values = Array.from({ length: 8 }, (_, mask) => 100 + effect.reduce((a, e, i) => a + (mask & (1 << i) ? e : 0), 0));
    const terms = separateFactors(values, 3);
    for (const term of terms) {
      const expected = bitCount(term.mask) === 1 ? effect[Math.log2(term.mask)] : 0;
      expect(term.value).toBeCloseTo(expected, 12);
    }
  });

  it('refuses a wrong number of combinations', () => {
    expect(() => separateFactors([1, 2, 3], 2)).toThrow(/need 4 values/);
  });
});
