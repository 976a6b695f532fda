import { describe, expect, it } from 'vitest';
import { expectWithin } from '../../tests/support/within';
import { simulate } from './simulate';
import type { SimulationResult } from './result';
import { inventedValley } from './fixtures/invented-valley';
import { glacierShortwave, impliedDegreeDayFactors, PUBLISHED_RANGES } from '../analysis/plausibility';

/**
 * A whole melt season of a second invented catchment — an Alpine-style valley at 46° N with a
 * station at 2100 m, no radiation or cloud data (so the shortwave comes from the daily temperature
 * range, the product's most common case) and the background loads of Alpine snow — judged against:
 *  - degree-day factors reviewed by Hock 2003: snow 2.5–11.6, ice 6.6–20 mm w.e. d⁻¹ K⁻¹ [memory];
 *  - June–August incoming shortwave on Alpine glaciers, 180–300 W m⁻² at automatic weather
 *    stations (e.g. Oerlemans 2010 on Morteratschgletscher; Gabbi et al. 2014) [memory];
 *  - 100 ng g⁻¹ more black carbon in fresh snow and 500 ng g⁻¹ more on ice adding 5–40 % to the
 *    season's runoff (the range reported for polluted High Mountain Asian glaciers, a bound for
 *    cleaner Alpine ice too) [memory];
 *  - a second spin-up year changing the season's runoff by less than 5 % (common practice).
 */
const valley = inventedValley({ years: 4, bandCount: 12 });
const { cloudiness: _withoutCloud, ...forcing } = valley.forcing;
const site = { ...valley, forcing, catchment: { ...valley.catchment, background: { blackCarbonSnowNgG: 20, dustSnowUgG: 5 } } };
const season = { from: '2024-04-01', to: '2024-09-30' };
const run = (scenario: Record<string, number>, years = 1) => simulate({ ...site, scenario, period: season, start: { method: 'spin-up', years } });
const total = (r: SimulationResult) => r.catchmentDaily.volumeM3.total.reduce((a, v) => a + v, 0);
const baseline = run({});

describe('an invented Alpine valley through a melt season', () => {
  it('takes its shortwave from the daily temperature range', () => expect(baseline.shortwaveSource).toBe('temperature-range'));
  it('implies degree-day factors inside the published ranges (Hock 2003)', () => {
    const ddf = impliedDegreeDayFactors(baseline);
    expectWithin(ddf.snow, PUBLISHED_RANGES.snowDegreeDayFactor, 'snow degree-day factor');
    expectWithin(ddf.ice, PUBLISHED_RANGES.iceDegreeDayFactor, 'ice degree-day factor');
  });
  it('receives summer shortwave on the glacier inside Alpine weather-station climatologies', () => {
    const sw = glacierShortwave(baseline, [5, 6, 7])!;
    expectWithin(sw, [180, 300], 'June–August shortwave on the glacier');
  });
  it('adds 5–40 % runoff with 100 ng g⁻¹ more black carbon in snow and 500 ng g⁻¹ more on ice', () => {
    const added = (total(run({ blackCarbonSnowNgG: 100, blackCarbonIceNgG: 500 })) - total(baseline)) / total(baseline);
    expectWithin(added, PUBLISHED_RANGES.darkeningAddedRunoff, 'added runoff, share of the baseline');
  });
  it('barely notices a longer spin-up (< 5 %)', () => {
    expect(Math.abs(total(run({}, 2)) - total(baseline)) / total(baseline)).toBeLessThan(0.05);
  });
});
