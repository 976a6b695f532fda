import { describe, expect, it } from 'vitest';
import { kgeParts } from '../melt/skill';
import { skillScores } from './skill-scores';
import { monthlyMeans, pairDaily } from './paired-series';

describe('skill scores against hand-computed values', () => {
  // observed o = [1, 2, 3, 4], simulated s = [2, 2, 4, 4]
  // ō = 2.5, s̄ = 3; Σ(o−s)² = 1+0+1+0 = 2; Σ(o−ō)² = 5 → NSE = 1 − 2/5 = 0.6
  // σo = √(5/4), σs = √(4/4) = 1 → α = 1/√1.25 = 0.894427; cov = Σ(o−ō)(s−s̄) = 1.5+0.5+0.5+1.5 = 4
  // r = 4/√(5·4) = 0.894427; β = 3/2.5 = 1.2
  // KGE = 1 − √((r−1)² + (α−1)² + 0.2²) = 1 − √(0.0111456 + 0.0111456 + 0.04) = 0.750418
  // bias = 100·(12 − 10)/10 = 20 %
  const scores = skillScores([1, 2, 3, 4], [2, 2, 4, 4]);
  it('NSE', () => expect(scores.nse).toBeCloseTo(0.6, 10));
  it('KGE and its parts', () => {
    expect(scores.r).toBeCloseTo(0.894427, 6);
    expect(scores.alpha).toBeCloseTo(0.894427, 6);
    expect(scores.beta).toBeCloseTo(1.2, 10);
    expect(scores.kge).toBeCloseTo(0.750418, 5);
  });
  it('percent bias and means', () => {
    expect(scores.biasPercent).toBeCloseTo(20, 10);
    expect(scores.meanObserved).toBe(2.5);
    expect(scores.meanSimulated).toBe(3);
    expect(scores.count).toBe(4);
  });
  it('the mean-flow predictor scores KGE = 1 − √2 with r = 0 (Knoben et al. 2019, HESS 23:4323)', () => {
    const s = skillScores([1, 2, 3, 4], [2.5, 2.5, 2.5, 2.5]);
    expect(s.kge).toBeCloseTo(1 - Math.SQRT2, 10);
    expect(kgeParts([1, 2, 3, 4], [2.5, 2.5, 2.5, 2.5])).toEqual({ r: 0, alpha: 0, beta: 1 });
    expect(s.nse).toBeCloseTo(0, 10);
  });
  it('refuses a constant observed series with the engine\'s message', () => {
    expect(() => skillScores([2, 2, 2], [1, 2, 3])).toThrow(/does not vary/);
  });
});

describe('pairing and monthly aggregation', () => {
  it('pairs observations with simulated days inside the period only', () => {
    const paired = pairDaily(
      [{ date: '2022-06-03', value: 3 }, { date: '2022-06-01', value: 1 }, { date: '2022-05-31', value: 9 }, { date: '2022-06-09', value: 9 }],
      '2022-06-01', [10, 20, 30, 40], { from: '2022-06-01', to: '2022-06-30' },
    );
    expect(paired).toEqual({ dates: ['2022-06-01', '2022-06-03'], observed: [1, 3], simulated: [10, 30] });
  });
  it('averages months with at least 20 paired days', () => {
    const dates = Array.from({ length: 40 }, (_, d) => new Date(Date.UTC(2022, 5, 1 + d)).toISOString().slice(0, 10));
    // June: 30 days (observed 1…30, simulated 2× that); July: 10 days only → left out
    const monthly = monthlyMeans({ dates, observed: dates.map((_, d) => d + 1), simulated: dates.map((_, d) => 2 * (d + 1)) });
    expect(monthly).toEqual({ dates: ['2022-06'], observed: [15.5], simulated: [31] });
  });
});
