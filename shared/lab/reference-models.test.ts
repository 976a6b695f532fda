import { describe, expect, it } from 'vitest';
import { inventedValley } from '../melt/fixtures/invented-valley';
import { simulateDegreeDay } from '../melt/index';
import { compareMeltModels } from './reference-models';

const valley = inventedValley({ bandCount: 6, timeStep: 'daily' });
const site = { ...valley, bandIndex: 3, period: { from: '2022-06-01', to: '2022-08-31' } };
const comparison = compareMeltModels(site);

describe('energy balance against reference melt models', () => {
  it('gives each model one value per day of the period', () => {
    expect(comparison.dates[0]).toBe('2022-06-01');
    expect(comparison.dates.at(-1)).toBe('2022-08-31');
    for (const m of comparison.models) {
      expect(m.dailyMm).toHaveLength(92);
      expect(m.totalMm).toBeCloseTo(m.dailyMm.reduce((s, v) => s + v, 0), 6);
      expect(m.totalMm).toBeCloseTo(m.snowMm + m.iceMm, 6);
      expect(m.totalMm).toBeGreaterThan(0);
    }
  });
  it('matches a degree-day run of the band alone over the same days', () => {
    const band = valley.catchment.bands[3];
    const alone = simulateDegreeDay({ ...valley, catchment: { ...valley.catchment, bands: [band] }, period: { from: valley.forcing.start, to: '2022-08-31' } });
    const first = 243; // 2021-10-01 + 243 days = 2022-06-01
    let melt = 0;
    for (let d = first; d < alone.dayCount; d++) melt += alone.bandDay.snowMeltMm[d] + alone.bandDay.iceMeltMm[d] + alone.bandDay.debrisIceMeltMm[d];
    expect(comparison.models.find((m) => m.key === 'degreeDay')!.totalMm).toBeCloseTo(melt, 6);
  });
});
