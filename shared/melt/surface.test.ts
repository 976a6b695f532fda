import { describe, expect, it } from 'vitest';
import { snowAlbedo, cleanSnowAlbedo, impurityAlbedoChange } from './snow-albedo';
import { buildSnowAlbedoTable, readTable, tablePosition } from './albedo-table';
import { iceAlbedo } from './ice-albedo';
import { DEFAULT_PARAMETERS } from './parameters';
import { buildEmissivityTable, readEmissivity, saturatedClearSkyEmissivity } from './longwave';

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

describe('albedo table used by the hour loop', () => {
  it('matches the formula within 2·10⁻⁵ between nodes', () => {
    const table = buildSnowAlbedoTable(1500, 500);
    for (let r = 30; r <= 1500; r += 7.3) {
      const pos = tablePosition(r);
      expect(Math.abs(readTable(table.clean, pos) - cleanSnowAlbedo(r))).toBeLessThan(2e-5);
      expect(Math.abs(readTable(table.impurity, pos) - impurityAlbedoChange(r, 500))).toBeLessThan(2e-5);
    }
  });
});

describe('air emissivity table (Brutsaert 1975)', () => {
  it('matches the formula within 10⁻⁶ from −40 to 40 °C', () => {
    const table = buildEmissivityTable();
    for (let t = -40; t <= 40; t += 0.37) expect(Math.abs(readEmissivity(table, t) - saturatedClearSkyEmissivity(t))).toBeLessThan(1e-6);
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
