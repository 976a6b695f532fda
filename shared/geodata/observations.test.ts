import { describe, expect, it } from 'vitest';
import { crsFromEpsg } from './crs';
import { deriveCatchment } from './derive';
import { elevationChangeByBand } from './elevation-change';
import { GeodataError } from './errors';
import type { Raster } from './raster';
import { snowCoverByBand } from './snow-cover';
import { pointTransform } from './reproject';
import { boxOutline, coneDem, UTM44N } from './test-fixtures';

/**
 * Snow cover and elevation change on synthetic rasters with known answers: a cone DEM split into
 * two 1000 m bands (3000–4000, 4000–5000 m), the northern half glacier-covered.
 */
const dem = coneDem();
const zones = deriveCatchment({ dem, catchment: boxOutline(15, 15, 5985, 5985, dem), glaciers: boxOutline(15, 15, 5985, 3000, dem) }, { bandWidthM: 1000, horizonSectors: 0 }).zones;

/** A raster on the DEM's own grid whose value depends on the cell's band, half (north/south) and column. */
function onGrid(value: (band: number, north: boolean, col: number) => number, crs = UTM44N): Raster {
  const values = new Float32Array(dem.width * dem.height).fill(NaN);
  for (let i = 0; i < values.length; i++) {
    const band = zones.band[i];
    if (band >= 0) values[i] = value(band, Math.floor(i / dem.width) < dem.height / 2, i % dem.width);
  }
  return { ...dem, values, crs };
}

describe('snow-covered fraction per band', () => {
  const codes = { snow: [200], noSnow: [25], cloud: [50], nodata: [255] };
  it('masks cloud and keeps the valid fraction: band 1 has 10 snow, 6 no-snow and 4 cloud cells in every 20', () => {
    // by column: 0–9 snow, 10–15 no snow, 16–19 cloud in the lower band; all snow in the upper band
    const map = onGrid((band, _n, col) => (band === 1 ? 200 : col % 20 < 10 ? 200 : col % 20 < 16 ? 25 : 50));
    const { rows, catchment } = snowCoverByBand(map, codes, zones);
    // the band's cells do not split exactly 10:6:4 (its rows are not multiples of 20 columns): count them
    const count = (test: (col: number) => boolean) => zones.band.reduce((n, b, i) => n + (b === 0 && test(i % dem.width) ? 1 : 0), 0);
    const all = count(() => true);
    const snow = count((c) => c % 20 < 10);
    const seen = count((c) => c % 20 < 16);
    expect(rows[0].snowCoveredFraction).toBeCloseTo(snow / seen, 3);
    expect(rows[0].validFraction).toBeCloseTo(seen / all, 3);
    expect(rows[0].cloudFraction).toBeCloseTo((all - seen) / all, 3);
    expect(rows[1]).toMatchObject({ snowCoveredFraction: 1, validFraction: 1, cloudFraction: 0 });
    expect(catchment.validFraction).toBeGreaterThan(0.8);
  });

  it('reads a map in another system by the class under each cell centre', () => {
    // the same "all snow in the north half" map written in longitude/latitude
    const wgs84 = crsFromEpsg(4326, 'snowCover');
    const [west, north] = pointTransform(UTM44N, wgs84)(dem.x0 - 500, dem.y0 + 500);
    // snow in the northern rows only: every band is partly snow-covered
    const map: Raster = { width: 200, height: 200, x0: west, y0: north, dx: 0.0005, dy: 0.0005, crs: wgs84, values: new Float32Array(200 * 200).map((_, i) => (Math.floor(i / 200) < 70 ? 200 : 25)) };
    const { rows } = snowCoverByBand(map, codes, zones);
    for (const row of rows) {
      expect(row.validFraction).toBeGreaterThan(0.99);
      expect(row.snowCoveredFraction).toBeGreaterThan(0);
      expect(row.snowCoveredFraction).toBeLessThan(1);
    }
  });

  it('says which class codes were left unassigned, refuses overlapping codes and maps that miss the catchment', () => {
    const map = onGrid((_b, north) => (north ? 7 : 200));
    expect(snowCoverByBand(map, codes, zones).notices[0].message).toMatch(/\(e\.g\. 7\)/);
    expect(() => snowCoverByBand(map, { ...codes, cloud: [25] }, zones)).toThrow(/given for more than one class/);
    const elsewhere: Raster = { ...map, x0: map.x0 + 100_000 };
    expect(() => snowCoverByBand(elsewhere, codes, zones)).toThrow(GeodataError);
  });
});

describe('glacier elevation change per band', () => {
  it('turns −1 and −0.4 m per year into −0.85 and −0.34 m w.e. per year at 850 ± 60 kg m⁻³ (Huss 2013)', () => {
    // stable ground: −0.1, 0, +0.1 m/yr by column (median 0; median absolute deviation 0.1, so NMAD 0.14826)
    const rate = onGrid((band, north, col) => (north ? (band === 0 ? -1 : -0.4) : ((col % 3) - 1) * 0.1));
    const { rows, glacier, stable, notices } = elevationChangeByBand({ kind: 'rate', dhdt: rate }, zones);
    expect(rows.map((r) => r.balanceMwePerYear)).toEqual([expect.closeTo(-0.85, 6), expect.closeTo(-0.34, 6)]);
    expect(stable?.medianMPerYear).toBeCloseTo(0, 6);
    expect(notices).toEqual([]);
    // σB² = (ḣ σρ/ρw)² + (ρ σḣ/ρw)²; σḣ = √((NMAD·√(πL²/5A))² + median²)
    const row = rows[0];
    const nmad = 1.4826 * 0.1;
    expect(stable?.nmadMPerYear).toBeCloseTo(nmad, 6);
    const areaM2 = row.glacierAreaKm2 * 1e6;
    const sigmaDh = nmad * Math.sqrt((Math.PI * 500 ** 2) / (5 * areaM2));
    expect(row.dhdtSigmaMPerYear).toBeCloseTo(sigmaDh, 9);
    expect(row.balanceSigmaMwePerYear).toBeCloseTo(Math.hypot(0.06, 0.85 * sigmaDh), 9);
    expect(glacier.coveredFraction).toBe(1);
    expect(glacier.balanceMwePerYear).toBeLessThan(-0.34);
  });

  it('differences two dated DEMs: −20 m in 20 years is −1 m per year', () => {
    const before = onGrid(() => 4000);
    const after = onGrid((_b, north) => (north ? 3980 : 4000));
    const { rows, years } = elevationChangeByBand({ kind: 'two-dems', before, after, beforeDate: '2000-09-15', afterDate: '2020-09-15' }, zones);
    expect(years).toBeCloseTo(20, 2);
    for (const row of rows) expect(row.dhdtMPerYear).toBeCloseTo(-20 / years!, 6);
  });

  it('keeps the covered share when data are missing and warns about short periods', () => {
    const patchy = onGrid((_b, north, col) => (north ? (col % 4 === 0 ? NaN : -1) : 0));
    const patchyRows = elevationChangeByBand({ kind: 'rate', dhdt: patchy }, zones).rows;
    expect(patchyRows[0].coveredFraction).toBeCloseTo(0.75, 2);
    expect(patchyRows[0].dhdtMPerYear).toBeCloseTo(-1, 6);
    const before = onGrid(() => 4000);
    const short = elevationChangeByBand({ kind: 'two-dems', before, after: before, beforeDate: '2019-01-01', afterDate: '2021-01-01' }, zones);
    expect(short.notices.map((n) => n.code)).toContain('short_period');
    expect(() => elevationChangeByBand({ kind: 'two-dems', before, after: before, beforeDate: '2021-01-01', afterDate: '2019-01-01' }, zones)).toThrow(/dated after/);
  });
});
