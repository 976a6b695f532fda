import { describe, expect, it } from 'vitest';
import { snowAlbedo, cleanSnowAlbedo, impurityAlbedoChange, cloudAlbedoChange, thinSnowAlbedo } from './snow-albedo';
import { cloudTermTable, loadPosition, radiusPosition, readClean, readCloudTerm, readImpurity, snowAlbedoTable } from './albedo-table';
import { readTable } from './temperature-table';
import { iceAlbedo } from './ice-albedo';
import { DEFAULT_PARAMETERS } from './parameters';
import { buildEmissivityTable, saturatedClearSkyEmissivity } from './longwave';
import { saturationOverIce, surfaceTablePosition, surfaceVapourTable } from './vapour';

const clean = { blackCarbonNgG: 0, dustUgG: 0 };
const drop = (radius: number, bc: number) => snowAlbedo({ grainRadiusUm: radius, ...clean }) - snowAlbedo({ grainRadiusUm: radius, blackCarbonNgG: bc, dustUgG: 0 });

/**
 * Albedo against handbook ranges, Paterson 1994 Table 4.1 / Cuffey & Paterson 2010 Table 5.2 [memory]:
 * dry snow 0.80–0.97, melting snow 0.66–0.88, clean ice 0.34–0.51, dirty ice 0.15–0.25,
 * debris-covered ice 0.10–0.15. Black-carbon reductions against Warren 2013 (JGR 118:779) [read]:
 * 3–30 ng/g lowers albedo 0–1 % in cold fine snow and 0–3 % in melting snow; ~20 ng/g gives
 * 1–2 % (Warren 2019) [read]. Tolerance: the stated range itself, in albedo units.
 */
describe('snow albedo (Gardner & Sharp 2010)', () => {
  it('fresh fine snow (r = 60 µm, sun at 60°) lies in the dry-snow range 0.80–0.97', () => {
    const a = snowAlbedo({ grainRadiusUm: 60, ...clean, cosZenith: 0.5 });
    expect(a).toBeGreaterThanOrEqual(0.8);
    expect(a).toBeLessThanOrEqual(0.97);
  });
  it('coarse melting snow (r = 1000 µm, sun at 60°) lies in the melting-snow range 0.66–0.88', () => {
    const a = snowAlbedo({ grainRadiusUm: 1000, ...clean, cosZenith: 0.5 });
    expect(a).toBeGreaterThanOrEqual(0.66);
    expect(a).toBeLessThanOrEqual(0.88);
  });
  it('albedo falls as grains grow', () => {
    expect(cleanSnowAlbedo(100)).toBeGreaterThan(cleanSnowAlbedo(500));
  });
  it('3–30 ng/g black carbon lowers cold fine snow (r = 60 µm) by 0–1 % (Warren 2013; 0.1 % tolerance)', () => {
    expect(drop(60, 3)).toBeGreaterThan(0);
    expect(drop(60, 30)).toBeLessThanOrEqual(0.011);
  });
  it('3–30 ng/g black carbon lowers melting snow (r = 500 µm) by 0–3 % (Warren 2013)', () => {
    expect(drop(500, 3)).toBeGreaterThan(0);
    expect(drop(500, 30)).toBeLessThanOrEqual(0.03);
  });
  it('20 ng/g black carbon lowers aged snow (r = 200 µm) by 1–2 % (Warren 2019)', () => {
    expect(drop(200, 20)).toBeGreaterThanOrEqual(0.01);
    expect(drop(200, 20)).toBeLessThanOrEqual(0.02);
  });
  it('the same load darkens coarse snow more than fine snow', () => {
    expect(drop(1000, 100)).toBeGreaterThan(drop(100, 100));
  });
  it('albedo falls as black carbon or dust rises, across the accepted range', () => {
    for (const r of [60, 300, 1500]) {
      let previous = Infinity;
      for (const bc of [0, 10, 100, 1000, 10_000, 50_000]) {
        const a = snowAlbedo({ grainRadiusUm: r, blackCarbonNgG: bc, dustUgG: 5000 * (bc / 50_000) });
        expect(a).toBeLessThan(previous);
        previous = a;
      }
    }
  });
  it('refuses grain radius or loads outside the accepted range', () => {
    expect(() => snowAlbedo({ grainRadiusUm: 5, ...clean })).toThrow(/grain radius/);
    expect(() => snowAlbedo({ grainRadiusUm: 100, blackCarbonNgG: -1, dustUgG: 0 })).toThrow(/black carbon/);
  });
});

describe('cloud and thin snow', () => {
  it('cloud raises the albedo of snow by the Gardner & Sharp 2010 cloud term, rising with optical thickness (hand-computed)', () => {
    const clean = cleanSnowAlbedo(500);
    expect(cloudAlbedoChange(clean, 0, 0)).toBe(0);
    expect(cloudAlbedoChange(clean, 0, 1)).toBeCloseTo((0.1 * clean ** 1.3) / 2.5 ** clean, 12);
    const thin = cloudAlbedoChange(clean, 0, 3);
    const thick = cloudAlbedoChange(clean, 0, 30);
    expect(thick).toBeGreaterThan(thin);
    expect(thick).toBeCloseTo((0.1 * 30 * clean ** 1.3) / 46 ** clean, 12);
  });
  it('under thick cloud the sun angle no longer matters (effective cos Z = 0.64)', () => {
    const low = snowAlbedo({ grainRadiusUm: 300, blackCarbonNgG: 0, dustUgG: 0, cosZenith: 0.2, cloudOpticalThickness: 20 });
    const high = snowAlbedo({ grainRadiusUm: 300, blackCarbonNgG: 0, dustUgG: 0, cosZenith: 0.9, cloudOpticalThickness: 20 });
    expect(low).toBeCloseTo(high, 12);
  });
  it('thin snow over ice shows the ice (Oerlemans & Knap 1998, d* = 3.2 cm): at d = d* the albedo is 63 % of the way back to the ice', () => {
    expect(thinSnowAlbedo(0.8, 0.34, 0.032, 0.032)).toBeCloseTo(0.8 - 0.46 * Math.exp(-1), 12);
    expect(thinSnowAlbedo(0.8, 0.34, 0.5, 0.032)).toBeCloseTo(0.8, 6);
  });
});

describe('tables used by the hour loop', () => {
  const table = snowAlbedoTable();
  it('snow albedo: clean column within 2·10⁻⁵ and impurity change within 2·10⁻³ of the formula, 30 … 3000 µm × 0 … 50 000 ng g⁻¹', () => {
    for (let r = 30; r <= 3000; r += 37.3) {
      const pos = radiusPosition(r);
      expect(Math.abs(readClean(table, pos) - cleanSnowAlbedo(r))).toBeLessThan(2e-5);
      for (const load of [0, 3, 30, 170, 900, 4000, 21_000, 50_000]) {
        expect(Math.abs(readImpurity(table, pos, loadPosition(load)) - impurityAlbedoChange(r, load))).toBeLessThan(2e-3);
      }
    }
  });
  it('cloud term within 10⁻⁴ of the formula', () => {
    const cloud = cloudTermTable();
    for (const r of [60, 300, 1200]) for (const load of [0, 300, 3000]) for (const tau of [0.5, 4, 17, 60]) {
      const clean = cleanSnowAlbedo(r);
      const change = impurityAlbedoChange(r, load);
      expect(Math.abs(readCloudTerm(cloud, clean, clean + change, tau, Math.log(1 + 1.5 * tau)) - cloudAlbedoChange(clean, change, tau))).toBeLessThan(1e-4);
    }
  });
  it('air emissivity (Brutsaert 1975) within 10⁻⁶ from −40 to 40 °C', () => {
    const emissivity = buildEmissivityTable();
    for (let t = -40; t <= 40; t += 0.37) expect(Math.abs(readTable(emissivity, t) - saturatedClearSkyEmissivity(t))).toBeLessThan(1e-6);
  });
  it('saturation over ice at the surface within 10⁻² Pa from −60 to 0 °C', () => {
    const vapour = surfaceVapourTable();
    for (let t = -60; t <= 0; t += 0.37) {
      const x = surfaceTablePosition(t);
      const i = x | 0;
      const value = vapour.pressurePa[i] + (vapour.pressurePa[i + 1] - vapour.pressurePa[i]) * (x - i);
      expect(Math.abs(value - saturationOverIce(t))).toBeLessThan(1e-2);
    }
  });
});

describe('ice and debris albedo', () => {
  const rule = { blackCarbonSlope: DEFAULT_PARAMETERS.iceAlbedoBlackCarbonSlope, dustSlope: DEFAULT_PARAMETERS.iceAlbedoDustSlope, floor: DEFAULT_PARAMETERS.iceAlbedoFloor };
  it('default clean ice lies in the clean-ice range 0.34–0.51', () => {
    expect(iceAlbedo(DEFAULT_PARAMETERS.iceAlbedo, 0, 0, rule)).toBeGreaterThanOrEqual(0.34);
    expect(iceAlbedo(DEFAULT_PARAMETERS.iceAlbedo, 0, 0, rule)).toBeLessThanOrEqual(0.51);
  });
  it('heavily loaded ice (2000 ng/g BC, 100 µg/g dust) lies in the dirty-ice range 0.15–0.25', () => {
    const a = iceAlbedo(DEFAULT_PARAMETERS.iceAlbedo, 2000, 100, rule);
    expect(a).toBeGreaterThanOrEqual(0.15);
    expect(a).toBeLessThanOrEqual(0.25);
  });
  it('never falls below the floor', () => expect(iceAlbedo(0.34, 50_000, 5000, rule)).toBe(rule.floor));
  it('default debris albedo lies in the debris-covered-ice range 0.10–0.15', () => {
    expect(DEFAULT_PARAMETERS.debrisAlbedo).toBeGreaterThanOrEqual(0.1);
    expect(DEFAULT_PARAMETERS.debrisAlbedo).toBeLessThanOrEqual(0.15);
  });
});
