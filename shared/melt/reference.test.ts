import { describe, expect, it } from 'vitest';
import { solarPosition } from './solar-position';
import { cosIncidence } from './incidence';
import { clearSkyDaily, extraterrestrialDaily } from './fao56';
import { pressureAt } from './pressure';
import { meltMmPerDay } from './energy';
import { MELTING_SURFACE_LONGWAVE_WM2 } from './constants';
import { nse, kge } from './skill';

/**
 * Reference checks against published values. Tolerance table (units of the quantity):
 *   sun zenith/azimuth vs NREL SPA ........ 0.1°   (docs/science.md: suncalc 2.x lands within ~0.1°)
 *   incidence angle vs SPA ................ 0.01°
 *   Ra vs FAO-56 Example 8 ................ 0.05 MJ m⁻² d⁻¹ (published to 0.1)
 *   pressure vs ICAO table ................ 0.05 %
 *   energy-to-melt ........................ 10⁻⁴ mm w.e.; melting-surface emission 0.1 W m⁻²
 *   NSE / KGE on hand-worked series ....... 10⁻¹²
 */
describe('sun position (Reda & Andreas 2004, NREL SPA worked example)', () => {
  // 2003-10-17 12:30:30 local time, UTC−7; 39.742476 N, 105.1786 W; topocentric zenith 50.111622°, azimuth 194.340241° [read].
  const sun = solarPosition(new Date('2003-10-17T19:30:30Z'), 39.742476, -105.1786);
  it('zenith within 0.1° of SPA', () => expect(Math.abs(sun.zenithDeg - 50.111622)).toBeLessThan(0.1));
  it('azimuth (clockwise from north) within 0.1° of SPA', () => expect(Math.abs(sun.azimuthDeg - 194.340241)).toBeLessThan(0.1));
  it('incidence on a 30° slope facing 170° is 25.187° (SPA example) within 0.01°', () => {
    const theta = (Math.acos(cosIncidence(50.111622, 194.340241, 30, 170)) * 180) / Math.PI;
    expect(Math.abs(theta - 25.187)).toBeLessThan(0.01);
  });
  it('a horizontal surface sees the sun at its zenith angle', () => {
    expect(cosIncidence(40, 123, 0, 270)).toBeCloseTo(Math.cos((40 * Math.PI) / 180), 12);
  });
});

describe('FAO-56 radiation (Allen et al. 1998)', () => {
  it('Ra at 20° S on 3 September (day 246) is 32.2 MJ m⁻² d⁻¹ (Example 8)', () => {
    expect(Math.abs(extraterrestrialDaily(-20, 246) - 32.2)).toBeLessThan(0.05);
  });
  it('Rso = (0.75 + 2·10⁻⁵ z) Ra (Eq. 37): 0.75 Ra at sea level, 0.79 Ra at 2000 m', () => {
    const ra = extraterrestrialDaily(-20, 246);
    expect(clearSkyDaily(-20, 246, 0)).toBeCloseTo(0.75 * ra, 10);
    expect(clearSkyDaily(-20, 246, 2000)).toBeCloseTo(0.79 * ra, 10);
  });
  it('polar night gives 0 and polar day a positive Ra (Eq. 25 clipped)', () => {
    expect(extraterrestrialDaily(80, 355)).toBe(0);
    expect(extraterrestrialDaily(80, 172)).toBeGreaterThan(40);
  });
  it('refuses a day of year outside 1 … 366', () => {
    expect(() => extraterrestrialDaily(10, 0)).toThrow(/dayOfYear/);
  });
});

describe('standard atmosphere (ICAO 1993 table) [memory for the table values]', () => {
  const table: [number, number][] = [[0, 101325], [1000, 89874.6], [3000, 70108.5], [5000, 54019.9]];
  it.each(table)('pressure at %i m is %f Pa within 0.05 %%', (z, p) => {
    expect(Math.abs(pressureAt(z) - p) / p).toBeLessThan(5e-4);
  });
});

describe('energy to melt (Lf = 3.34·10⁵ J kg⁻¹, computed from the constant)', () => {
  it('1 W m⁻² for a day melts 0.2587 mm w.e.', () => expect(Math.abs(meltMmPerDay(1) - 0.2587)).toBeLessThan(1e-4));
  it('a melting surface emits 315.6 W m⁻² (stated to 0.1)', () => expect(Math.abs(MELTING_SURFACE_LONGWAVE_WM2 - 315.6)).toBeLessThan(0.1));
  it('a deficit melts nothing', () => expect(meltMmPerDay(-50)).toBe(0));
});

describe('skill scores (Nash & Sutcliffe 1970; Gupta et al. 2009; Knoben et al. 2019)', () => {
  it('a perfect simulation scores 1', () => {
    expect(nse([1, 2, 3], [1, 2, 3])).toBe(1);
    expect(kge([1, 2, 3], [1, 2, 3])).toBe(1);
  });
  it('a series shifted by +1 on [1,2,3]: NSE = 1 − 3/2 = −0.5, KGE = 1 − |β − 1| = 0.5 (hand-worked)', () => {
    expect(nse([1, 2, 3], [2, 3, 4])).toBeCloseTo(-0.5, 12);
    expect(kge([1, 2, 3], [2, 3, 4])).toBeCloseTo(0.5, 12);
  });
  it('the mean-flow predictor scores NSE 0 and KGE 1 − √2 (Knoben et al. 2019)', () => {
    expect(nse([1, 2, 6], [3, 3, 3])).toBeCloseTo(0, 12);
    expect(kge([1, 2, 6], [3, 3, 3])).toBeCloseTo(1 - Math.SQRT2, 12);
  });
  it('doubled variability: [1,2,3] → [0,2,4] gives α = 2, KGE = 0 (hand-worked)', () => {
    expect(kge([1, 2, 3], [0, 2, 4])).toBeCloseTo(0, 12);
  });
  it('refuses mismatched or non-finite series instead of returning NaN', () => {
    expect(() => nse([1, 2], [1])).toThrow(/observed has 2/);
    expect(() => kge([1, Number.NaN], [1, 2])).toThrow(/observed\[1\]/);
    expect(() => nse([2, 2], [1, 2])).toThrow(/does not vary/);
  });
});
