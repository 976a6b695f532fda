import { describe, expect, it } from 'vitest';
import { simulate } from './simulate';
import { compareRuns } from './compare';
import { summariseByMonth } from './monthly';
import { inventedValley } from './fixtures/invented-valley';

const valley = inventedValley({ years: 1, bandCount: 4, timeStep: 'daily' });
const baseline = simulate(valley);
const variant = simulate({ ...valley, scenario: { blackCarbonSnowNgG: 500, temperatureDeltaC: 1 } });

describe('compareRuns', () => {
  const diff = compareRuns(baseline, variant);
  it('gives variant minus baseline for every series', () => {
    const nd = baseline.dayCount;
    expect(diff.bandDay.snowMeltMm[nd + 250]).toBeCloseTo(variant.bandDay.snowMeltMm[nd + 250] - baseline.bandDay.snowMeltMm[nd + 250], 12);
    expect(diff.catchmentDaily.dischargeM3s.total[200]).toBeCloseTo(variant.catchmentDaily.dischargeM3s.total[200] - baseline.catchmentDaily.dischargeM3s.total[200], 12);
    expect(diff.bandTotals.runoffMm[2]).toBeCloseTo(variant.bandTotals.runoffMm[2] - baseline.bandTotals.runoffMm[2], 9);
  });
  it('a warmer, darker variant adds melt', () => {
    expect(diff.catchmentDaily.volumeM3.snow.reduce((a, b) => a + b, 0) + diff.catchmentDaily.volumeM3.ice.reduce((a, b) => a + b, 0)).toBeGreaterThan(0);
  });
  it('refuses runs of different shape', () => {
    const shorter = simulate({ ...valley, period: { from: '2021-10-01', to: '2022-03-31' } });
    expect(() => compareRuns(baseline, shorter)).toThrow(/differ in shape/);
  });
});

describe('summariseByMonth', () => {
  const rows = summariseByMonth(baseline);
  it('has one row per band and calendar month', () => {
    expect(rows.length).toBe(4 * 12);
    expect(rows[0]).toMatchObject({ bandIndex: 0, month: '2021-10', days: 31 });
  });
  it('monthly totals add up to the band totals and volumes follow the band area', () => {
    for (let b = 0; b < 4; b++) {
      const bandRows = rows.filter((r) => r.bandIndex === b);
      expect(bandRows.reduce((a, r) => a + r.runoffMm, 0)).toBeCloseTo(baseline.bandTotals.runoffMm[b], 6);
      expect(bandRows[5].snowMeltM3).toBeCloseTo((bandRows[5].snowMeltMm / 1000) * baseline.bands.areaM2[b], 6);
    }
  });
  it('mean albedo is null or a plausible albedo, and absorbed shortwave is finite', () => {
    for (const r of rows) {
      if (r.meanAlbedo !== null) expect(r.meanAlbedo).toBeGreaterThan(0.1);
      expect(Number.isFinite(r.meanAbsorbedShortwaveWm2)).toBe(true);
    }
  });
});
