import { describe, expect, it } from 'vitest';
import { simulate } from '../melt/simulate';
import { inventedValley } from '../melt/fixtures/invented-valley';
import { summariseSimulation } from './simulation-summary';

describe('summariseSimulation', () => {
  const result = simulate({ ...inventedValley({ bandCount: 3, years: 1, timeStep: 'daily' }), period: { from: '2022-05-01', to: '2022-07-31' } });
  const summary = summariseSimulation(result);

  it('keeps one row per band and month, with the days of that month', () => {
    expect(summary.months).toHaveLength(3 * 3);
    expect(summary.months.filter((r) => r.bandIndex === 0).map((r) => [r.month, r.days])).toEqual([['2022-05', 31], ['2022-06', 30], ['2022-07', 31]]);
  });

  it('gives each energy component as the mean of its band\'s days in that month', () => {
    const nd = result.dayCount;
    const row = summary.months.find((r) => r.bandIndex === 2 && r.month === '2022-06')!;
    // June is days 31 … 60 of the run (May has 31 days).
    for (const field of ['netShortwaveWm2', 'netLongwaveWm2', 'sensibleHeatWm2'] as const) {
      let total = 0;
      for (let d = 31; d < 61; d++) total += result.bandDay[field][2 * nd + d];
      expect(row[field]).toBeCloseTo(total / 30, 9);
    }
  });
});
