import { describe, expect, it } from 'vitest';
import { simulate } from '../melt/index';
import { inventedValley } from '../melt/fixtures/invented-valley';
import { steadyClimate } from '../melt/fixtures/steady-climate';
import { compareGeodetic } from './geodetic-skill';
import { compareSnowCover, MIN_VALID_FRACTION } from './snow-cover-skill';

describe('snow cover against the engine', () => {
  const valley = inventedValley({ bandCount: 6, timeStep: 'daily' });
  const run = simulate(valley);
  const dayOf = (date: string, start: string) => Math.round((Date.parse(date) - Date.parse(start)) / 864e5);
  const coverOn = (b: number, date: string) => run.bandDay.snowCoverFraction[b * run.dayCount + dayOf(date, valley.forcing.start)];

  it('pairs each seen band and date with the engine\'s cover of that band and day, leaving out clouded bands and dates outside the record', () => {
    const bands = valley.catchment.bands;
    const observed = [
      { date: '2022-06-15', lowerM: bands[0].lowerM, upperM: bands[0].upperM, snowCoveredFraction: 0.1, validFraction: 0.9 },
      { date: '2022-06-15', lowerM: bands[5].lowerM, upperM: bands[5].upperM, snowCoveredFraction: 0.95, validFraction: 0.8 },
      { date: '2022-06-15', lowerM: bands[3].lowerM, upperM: bands[3].upperM, snowCoveredFraction: 0.5, validFraction: MIN_VALID_FRACTION / 2 },
      { date: '2031-06-15', lowerM: bands[3].lowerM, upperM: bands[3].upperM, snowCoveredFraction: 0.5, validFraction: 1 },
    ];
    const c = compareSnowCover(valley, observed);
    expect(c.leftOut).toBe(2);
    expect(c.pairs.map((p) => p.simulatedFraction)).toEqual([0, 5].map((b) => coverOn(b, '2022-06-15')));
    const errors = c.pairs.map((p) => p.simulatedFraction - p.snowCoveredFraction);
    expect(c.meanError).toBeCloseTo((errors[0] + errors[1]) / 2, 12);
    expect(c.rmse).toBeCloseTo(Math.sqrt((errors[0] ** 2 + errors[1] ** 2) / 2), 12);
  });

  it('weights the response units of a band by their area', () => {
    const bands = valley.catchment.bands;
    const split = { ...valley, catchment: { ...valley.catchment, bands: [...bands.slice(0, 5), { ...bands[5], areaKm2: 3, aspectDeg: 0 }, { ...bands[5], areaKm2: 1, aspectDeg: 180 }] } };
    const c = compareSnowCover(split, [{ date: '2022-08-20', lowerM: bands[5].lowerM, upperM: bands[5].upperM, snowCoveredFraction: 0.6, validFraction: 1 }]);
    const r = simulate(split);
    const cover = (b: number) => r.bandDay.snowCoverFraction[b * r.dayCount + dayOf('2022-08-20', split.forcing.start)];
    expect(c.pairs[0].simulatedFraction).toBeCloseTo(0.75 * cover(5) + 0.25 * cover(6), 12);
  });
});

describe('geodetic balance against the engine', () => {
  it('equals minus the ice lost (melt and vapour) per glacier area per year on snow-free ice without precipitation (a known answer)', () => {
    const site = steadyClimate({ days: 400, meanC: 2, bands: [{ glacierFraction: 0.5 }] });
    const run = simulate(site);
    const band = site.catchment.bands[0];
    const c = compareGeodetic(site, [{ fromDate: '1990-01-01', toDate: '2000-01-01', lowerM: band.lowerM, upperM: band.upperM, glacierAreaKm2: 1, balanceMwePerYear: -3, sigmaMwePerYear: 0.3 }]);
    expect(c.periodsDiffer).toBe(true);
    const days = 365;
    let ice = 0;
    for (let d = 0; d < days; d++) ice += run.bandDay.iceMeltMm[d] + run.bandDay.debrisIceMeltMm[d] + run.bandDay.iceVapourLossMm[d];
    expect(c.rows[0].simulatedMwePerYear).toBeCloseTo(-ice / 0.5 / 1000 / (days / 365.25), 6);
    expect(c.glacierWide.simulatedMwePerYear).toBeCloseTo(c.rows[0].simulatedMwePerYear, 12);
  });

  it('gives a balance that rises with elevation over the invented valley, scored across the bands', () => {
    const valley = inventedValley({ bandCount: 6, timeStep: 'daily' });
    const glacierBands = valley.catchment.bands.filter((b) => b.glacierFraction > 0);
    const observed = glacierBands.map((b, i) => ({ fromDate: valley.forcing.start, toDate: '2030-01-01', lowerM: b.lowerM, upperM: b.upperM, glacierAreaKm2: b.areaKm2 * b.glacierFraction, balanceMwePerYear: -2 + 0.5 * i, sigmaMwePerYear: 0.2 }));
    const c = compareGeodetic(valley, observed);
    const simulated = c.rows.map((r) => r.simulatedMwePerYear);
    for (let i = 1; i < simulated.length; i++) expect(simulated[i]).toBeGreaterThan(simulated[i - 1]);
    expect(c.scores?.count).toBe(glacierBands.length);
    expect(c.withinTwoSigma).toBeGreaterThanOrEqual(0);
    expect(c.withinTwoSigma).toBeLessThanOrEqual(1);
    // every band's σ is 0.2: fully correlated errors leave the glacier-wide σ at 0.2
    expect(c.glacierWide.sigmaMwePerYear).toBeCloseTo(0.2, 12);
  });
});
