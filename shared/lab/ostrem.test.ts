import { describe, expect, it } from 'vitest';
import { inventedValley } from '../melt/fixtures/invented-valley';
import { criticalThickness, ostremFamily, OSTREM_THICKNESSES_M } from './ostrem';
import { warmingResponse } from './warming-response';
import type { BandSite } from './site';

// The invented valley's climate (the demo climate of the engine's fixtures), summer of 2022,
// on its third band (≈ 2900–3200 m, 1 km above the station).
const valley = inventedValley({ bandCount: 6, timeStep: 'daily' });
const site: BandSite = { ...valley, bandIndex: 2, period: { from: '2022-06-01', to: '2022-08-31' } };
const family = ostremFamily(site);
const meltAt = (h: number) => {
  const i = OSTREM_THICKNESSES_M.findIndex((t) => t >= h);
  return family.present.points[i].meltMm;
};

describe('Østrem curve from the lab (Østrem 1959 shape [memory])', () => {
  it('spans 5 mm to 1 m of debris, log-spaced', () => {
    expect(OSTREM_THICKNESSES_M[0]).toBeCloseTo(0.005, 6);
    expect(OSTREM_THICKNESSES_M.at(-1)).toBe(1);
    const ratios = OSTREM_THICKNESSES_M.slice(1).map((h, i) => h / OSTREM_THICKNESSES_M[i]);
    for (const r of ratios) expect(r).toBeCloseTo(ratios[0], 9);
  });
  it('rises above clean-ice melt under thin debris', () => {
    expect(family.present.cleanIceMeltMm).toBeGreaterThan(100);
    expect(family.present.peak.meltMm).toBeGreaterThan(family.present.cleanIceMeltMm);
    expect(family.present.peak.thicknessM).toBeLessThan(0.03);
  });
  it('falls far below clean-ice melt at 0.5 m (under a third of it)', () => {
    expect(meltAt(0.5)).toBeLessThan(family.present.cleanIceMeltMm / 3);
  });
  it('marks a critical thickness of a few centimetres where melt equals clean ice', () => {
    const hc = family.present.criticalThicknessM!;
    expect(hc).toBeGreaterThan(family.present.peak.thicknessM);
    expect(hc).toBeGreaterThan(0.005);
    expect(hc).toBeLessThan(0.1);
  });
  it('melts more at every thickness when warmer, and more under darker debris', () => {
    family.warmer.forEach((curve, k) => {
      const colder = k === 0 ? family.present : family.warmer[k - 1];
      curve.points.forEach((p, i) => expect(p.meltMm).toBeGreaterThan(colder.points[i].meltMm));
    });
    family.darker.points.forEach((p, i) => expect(p.meltMm).toBeGreaterThan(family.present.points[i].meltMm));
    expect(family.darker.debrisAlbedo).toBeLessThan(family.present.debrisAlbedo);
  });
  it('shows thick debris responding less to warming than clean ice', () => {
    const response = warmingResponse(family, 0.3);
    expect(response.cleanIcePerC).toBeGreaterThan(0);
    expect(response.bandDebris!.thicknessM).toBeGreaterThan(0.2);
    expect(response.bandDebris!.perC).toBeLessThan(response.cleanIcePerC / 2);
    expect(warmingResponse(family, 0).bandDebris).toBeNull();
  });
});

describe('critical thickness interpolation', () => {
  it('interpolates in log thickness between the points around the crossing', () => {
    const points = [{ thicknessM: 0.01, meltMm: 120 }, { thicknessM: 0.02, meltMm: 110 }, { thicknessM: 0.04, meltMm: 90 }];
    // crossing 100 halfway from 110 to 90 → √(0.02·0.04)
    expect(criticalThickness(points, 100)).toBeCloseTo(Math.sqrt(0.02 * 0.04), 9);
  });
  it('is null when no debris melts more than clean ice', () => {
    expect(criticalThickness([{ thicknessM: 0.01, meltMm: 90 }, { thicknessM: 0.1, meltMm: 50 }], 100)).toBeNull();
  });
});
