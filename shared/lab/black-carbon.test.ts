import { describe, expect, it } from 'vitest';
import { inventedValley } from '../melt/fixtures/invented-valley';
import { BLACK_CARBON_NG_G, impurityCurves } from './black-carbon';
import type { BandSite } from './site';

const valley = inventedValley({ bandCount: 6, timeStep: 'daily' });
const site: BandSite = { ...valley, bandIndex: 2, period: { from: '2022-06-01', to: '2022-08-31' } };
const curves = impurityCurves(site);
const bySurface = Object.fromEntries(curves.map((c) => [c.surface, c.points.map((p) => p.meltMm)]));
const rise = (melt: number[]) => melt.at(-1)! - melt[0];

describe('melt against black carbon', () => {
  it('spans 0 to 5000 ng/g, log-spaced above 1 ng/g', () => {
    expect(BLACK_CARBON_NG_G[0]).toBe(0);
    expect(BLACK_CARBON_NG_G[1]).toBe(1);
    expect(BLACK_CARBON_NG_G.at(-1)).toBe(5000);
  });
  it('never falls as black carbon rises, for every surface', () => {
    for (const c of curves) {
      for (let i = 1; i < c.points.length; i++) expect(c.points[i].meltMm).toBeGreaterThanOrEqual(c.points[i - 1].meltMm);
      expect(rise(c.points.map((p) => p.meltMm))).toBeGreaterThan(0);
    }
  });
  it('is steeper for coarse grains than fine (Warren 2013, JGR 118:779: impurities matter more in coarse melting snow)', () => {
    expect(rise(bySurface.oldSnow)).toBeGreaterThan(rise(bySurface.freshSnow));
    // also per unit load in the range Warren 2013 reports for remote snow (3–30 ng/g)
    const at = (bc: number) => BLACK_CARBON_NG_G.findIndex((x) => x >= bc);
    const fine = bySurface.freshSnow[at(30)] - bySurface.freshSnow[at(3)];
    const coarse = bySurface.oldSnow[at(30)] - bySurface.oldSnow[at(3)];
    expect(coarse).toBeGreaterThan(fine);
  });
  it('coarse snow melts more than fine snow at any load (lower clean albedo)', () => {
    bySurface.oldSnow.forEach((m, i) => expect(m).toBeGreaterThan(bySurface.freshSnow[i]));
  });
});
