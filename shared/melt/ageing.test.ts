import { describe, expect, it } from 'vitest';
import { simulate } from './simulate';
import { steadyClimate } from './fixtures/steady-climate';

/**
 * Summer snow on a clean glacier ages as field records show. Conditions: a deep pack at 3000 m,
 * 46° N, July, air 3 °C on average with an 8 K daily range, cloudiness 0.2, RH 70 %, 2 m s⁻¹, and
 * the background loads of Alpine snow (20 ng g⁻¹ black carbon, 5 µg g⁻¹ dust [memory]).
 *  - Oerlemans & Knap 1998 (Morteratschgletscher) [read]: α(t) = 0.53 + (0.75 − 0.53) e^(−t/21.9 d).
 *  - Brock et al. 2000 (Haut Glacier d'Arolla) [memory for the coefficients]: deep snow
 *    α = 0.86 − 0.155 log10(ΣTmax), ΣTmax the sum of daily maximum temperatures (°C) since snowfall.
 * Tolerance: within 0.04 of Oerlemans & Knap between days 4 and 30, and between the two curves
 * (±0.05) for four weeks. Beyond a month Oerlemans & Knap's curve tends to their firn value, 0.53,
 * which one season's snow approaches more slowly in this model: by six weeks it is still falling
 * and below 0.65.
 */
const input = steadyClimate({ days: 45, start: '2022-07-01', meanC: 3, rangeC: 8, latitudeDeg: 46, initialSweMm: [3000] });
input.catchment.background = { blackCarbonSnowNgG: 20, dustSnowUgG: 5 };
const run = simulate(input);
const oerlemansKnap = (t: number) => 0.53 + 0.22 * Math.exp(-t / 21.9);
const brock = (t: number) => 0.86 - 0.155 * Math.log10(7 * t);

describe('snow albedo ages like summer snow on glaciers', () => {
  it('follows the Oerlemans & Knap 1998 decay within 0.04 from day 4 to day 30', () => {
    for (let d = 4; d <= 30; d++) expect(Math.abs(run.bandDay.albedo[d] - oerlemansKnap(d + 0.5))).toBeLessThan(0.04);
  });
  it('stays between the Oerlemans & Knap and Brock et al. curves (±0.05) for four weeks, and still falls below 0.65 by six weeks', () => {
    expect(run.bandDay.albedo[42]).toBeLessThan(0.65);
    expect(run.bandDay.albedo[42]).toBeLessThan(run.bandDay.albedo[28]);
    for (let d = 2; d < 28; d++) {
      const a = run.bandDay.albedo[d];
      const [low, high] = [oerlemansKnap(d + 0.5), brock(d + 1)].sort((x, y) => x - y);
      expect(a).toBeGreaterThan(low - 0.05);
      expect(a).toBeLessThan(high + 0.05);
    }
  });
  it('never falls below the firn albedo range (0.43–0.69, Paterson 1994) in six weeks of clean snow', () => {
    for (let d = 0; d < 45; d++) expect(run.bandDay.albedo[d]).toBeGreaterThan(0.43);
  });
  it('dark, loaded snow ages further: 300 ng g⁻¹ more black carbon ends at least 0.05 lower', () => {
    const dirty = simulate({ ...input, scenario: { blackCarbonSnowNgG: 300 } });
    expect(dirty.bandDay.albedo[40]).toBeLessThan(run.bandDay.albedo[40] - 0.05);
  });
});
