import { describe, expect, it } from 'vitest';
import { fitLine } from './line-fit';
import { HydrologyInputError } from './errors';

/**
 * Tolerances: Anscombe's published figures are given to 2–3 significant digits, so the checks
 * allow half a unit in the last published digit; hand-worked cases to 10⁻¹².
 */
describe('least-squares line', () => {
  it("reproduces Anscombe's (1973, Am. Stat. 27:17) data set I: y = 3.00 + 0.500 x, r² = 0.67, SE(slope) = 0.118 [memory for data and figures]", () => {
    const x = [10, 8, 13, 9, 11, 14, 6, 4, 12, 7, 5];
    const y = [8.04, 6.95, 7.58, 8.81, 8.33, 9.96, 7.24, 4.26, 10.84, 4.82, 5.68];
    const fit = fitLine(x, y, 'anscombe');
    expect(Math.abs(fit.slope - 0.5)).toBeLessThan(0.0005);
    expect(Math.abs(fit.intercept - 3.0)).toBeLessThan(0.005);
    expect(Math.abs(fit.r2 - 0.67)).toBeLessThan(0.005);
    expect(Math.abs(fit.slopeStandardError! - 0.118)).toBeLessThan(0.0005);
    expect(fit.n).toBe(11);
  });

  it('hand-worked: (0,0), (1,2), (2,1) gives slope 0.5, intercept 0.5, SSR 1.5, SE(slope) √0.75, SE(intercept) √1.25, r² 0.25', () => {
    const fit = fitLine([0, 1, 2], [0, 2, 1], 'points');
    expect(fit.slope).toBeCloseTo(0.5, 12);
    expect(fit.intercept).toBeCloseTo(0.5, 12);
    expect(fit.residualStandardDeviation).toBeCloseTo(Math.sqrt(1.5), 12);
    expect(fit.slopeStandardError).toBeCloseTo(Math.sqrt(0.75), 12);
    expect(fit.interceptStandardError).toBeCloseTo(Math.sqrt(1.25), 12);
    expect(fit.r2).toBeCloseTo(0.25, 12);
  });

  it('points on a line fit it exactly: −6 K per km through three stations', () => {
    const fit = fitLine([1000, 2000, 3000], [10, 4, -2], 'stations');
    expect(fit.slope * 1000).toBeCloseTo(-6, 12);
    expect(fit.r2).toBeCloseTo(1, 12);
    expect(fit.slopeStandardError).toBeCloseTo(0, 9);
  });

  it('two points give the line through them and no standard error', () => {
    const fit = fitLine([1000, 3000], [10, 0], 'stations');
    expect(fit.slope).toBeCloseTo(-0.005, 12);
    expect(fit.slopeStandardError).toBeNull();
    expect(fit.residualStandardDeviation).toBeNull();
  });

  it('fewer points than parameters is refused, naming the field and the reason', () => {
    expect(() => fitLine([2000], [5], 'stations')).toThrow(HydrologyInputError);
    expect(() => fitLine([2000], [5], 'stations')).toThrow(/stations: a straight line has two parameters, so it needs at least two points/);
  });

  it('refuses points at one position, unequal lengths and non-numbers', () => {
    expect(() => fitLine([2000, 2000], [5, 6], 'stations')).toThrow(/same position/);
    expect(() => fitLine([1, 2, 3], [1, 2], 'stations')).toThrow(/3 positions but 2 values/);
    expect(() => fitLine([1, 2, Number.NaN], [1, 2, 3], 'stations')).toThrow(/stations\[2\]/);
  });
});
