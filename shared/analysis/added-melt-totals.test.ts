import { describe, expect, it } from 'vitest';
import { simulate } from '../melt/simulate';
import { inventedValley } from '../melt/fixtures/invented-valley';
import { addedMeltTotals, dayByShare } from './added-melt-totals';
import { dailyRunoffM3, summariseSimulation } from './simulation-summary';

const season = { from: '2022-04-01', to: '2022-09-30' };
const input = inventedValley({ bandCount: 4, years: 1, timeStep: 'daily' });
const baseline = summariseSimulation(simulate({ ...input, period: season }));
const sooty = summariseSimulation(simulate({ ...input, period: season, scenario: { blackCarbonSnowNgG: 500, blackCarbonIceNgG: 2000 } }));

describe('added melt totals', () => {
  it('are zero for a variant identical to the baseline', () => {
    const totals = addedMeltTotals(baseline, baseline);
    expect(totals.addedVolumeM3).toBe(0);
    expect(totals.timingShiftDays).toBe(0);
    expect(totals.meanExtraAbsorbedShortwaveWm2).toBe(0);
  });

  it('show more melt and more absorbed shortwave when snow and ice darken', () => {
    const totals = addedMeltTotals(baseline, sooty);
    expect(totals.addedVolumeM3).toBeGreaterThan(0);
    expect(totals.meanExtraAbsorbedShortwaveWm2).toBeGreaterThan(0);
    expect(totals.meltSeason).not.toBeNull();
  });

  it('bring runoff earlier when only the snow darkens (it melts out sooner)', () => {
    const sootySnow = summariseSimulation(simulate({ ...input, period: season, scenario: { blackCarbonSnowNgG: 500 } }));
    expect(addedMeltTotals(baseline, sootySnow).timingShiftDays).toBeLessThanOrEqual(0);
  });

  it('keep depth, volume, share and discharge consistent with each other', () => {
    const totals = addedMeltTotals(baseline, sooty);
    const areaM2 = baseline.bands.reduce((a, b) => a + b.areaM2, 0);
    expect(totals.addedDepthMm).toBeCloseTo((totals.addedVolumeM3 / areaM2) * 1000, 9);
    expect(totals.addedVolumeMillionM3).toBeCloseTo(totals.addedVolumeM3 / 1e6, 12);
    const baseRunoff = dailyRunoffM3(baseline).reduce((a, b) => a + b, 0);
    expect(totals.addedShareOfBaselineRunoff).toBeCloseTo(totals.addedVolumeM3 / baseRunoff, 12);
    // The season holds 90 % of the melt, so its mean cannot be below volume / (all days) by much; it must be positive.
    expect(totals.meanAddedDischargeM3s).toBeGreaterThan(0);
  });

  it('finds the day by which a share of a series has accumulated', () => {
    expect(dayByShare([0, 1, 1, 2], 0.5)).toBe(2);
    expect(dayByShare([0, 0], 0.5)).toBe(-1);
  });

  it('refuses runs of different shape', () => {
    const shorter = summariseSimulation(simulate({ ...input, period: { from: '2022-04-01', to: '2022-08-31' } }));
    expect(() => addedMeltTotals(baseline, shorter)).toThrow(/same days and bands/);
  });
});
