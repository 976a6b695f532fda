import { describe, expect, it } from 'vitest';
import { DEMO_BANDS, DEMO_CATCHMENT } from '../../../seeds/data/demo-catchment';
import { deriveCatchment } from '../derive';
import { elevationChangeByBand } from '../elevation-change';
import { outlineFromGeoJson } from '../outline';
import { snowCoverByBand } from '../snow-cover';
import { generateDemoValley } from './demo-valley';

/** A thinning profile to draw: −2 m per year at the snout, rising 0.1 m per year every 100 m. */
const thinning = DEMO_BANDS.filter((b) => b.glacierFraction > 0).map((b, i) => ({ lowerM: b.lowerM, upperM: b.upperM, dhdtMPerYear: -2 + 0.2 * i }));
const place = { latitudeDeg: DEMO_CATCHMENT.latitudeDeg, longitudeDeg: DEMO_CATCHMENT.longitudeDeg, thinning };
const valley = generateDemoValley(DEMO_BANDS, place);
const derived = deriveCatchment({
  dem: valley.dem,
  catchment: outlineFromGeoJson(valley.catchment, 'catchmentOutline'),
  glaciers: outlineFromGeoJson(valley.glaciers, 'glacierOutline'),
  debris: outlineFromGeoJson(valley.debris, 'debrisOutline'),
  debrisThickness: valley.debrisThickness,
}, { bandWidthM: 200, horizonSectors: 16 });

describe('the generated demo valley', () => {
  it('is the same every time from its seed, and different from another seed', () => {
    const again = generateDemoValley(DEMO_BANDS, place);
    expect(sameValues(again.dem.values, valley.dem.values)).toBe(true);
    expect(JSON.stringify(again.glaciers)).toBe(JSON.stringify(valley.glaciers));
    const other = generateDemoValley(DEMO_BANDS, { ...place, seed: 99 });
    expect(sameValues(other.dem.values, valley.dem.values)).toBe(false);
  }, 60_000);

  it('derives bands that resemble the demo band table: area, glacier and debris cover band by band', () => {
    expect(derived.bands.map((b) => b.lowerM)).toEqual(DEMO_BANDS.map((b) => b.lowerM));
    expect(derived.notices).toEqual([]);
    derived.bands.forEach((band, i) => {
      const target = DEMO_BANDS[i];
      expect(Math.abs(band.areaKm2 - target.areaKm2) / target.areaKm2).toBeLessThan(0.03);
      expect(Math.abs(band.glacierFraction - target.glacierFraction)).toBeLessThan(0.03);
      expect(Math.abs(band.debrisFraction - target.debrisFraction)).toBeLessThan(0.05);
      if (target.debrisFraction > 0) expect(Math.abs(band.debrisThicknessM - target.debrisThicknessM)).toBeLessThan(0.3 * target.debrisThicknessM + 0.01);
      // a steep high valley draining north: slopes of mountain terrain, aspects within 60° of north
      expect(band.slopeDeg).toBeGreaterThan(10);
      expect(band.slopeDeg).toBeLessThan(50);
      expect(Math.abs(((band.aspectDeg + 180) % 360) - 180)).toBeLessThan(60);
      expect(band.skyViewFactor).toBeGreaterThan(0.6);
      expect(band.skyViewFactor).toBeLessThan(1);
    });
  });

  it('has snow maps whose snow line climbs through the melt season and falls back in autumn', () => {
    const fractions = valley.snowMaps.map((m) => snowCoverByBand(m.raster, valley.snowClassCodes, derived.zones));
    const catchmentShare = fractions.map((f) => f.catchment.snowCoveredFraction ?? NaN);
    expect(catchmentShare[0]).toBeGreaterThan(catchmentShare[1]);
    expect(catchmentShare[1]).toBeGreaterThan(catchmentShare[3]);
    expect(catchmentShare[5]).toBeGreaterThan(catchmentShare[4]);
    for (const f of fractions) {
      expect(f.rows[0].snowCoveredFraction ?? 0).toBeLessThan(f.rows.at(-1)?.snowCoveredFraction ?? 0);
      expect(f.catchment.validFraction).toBeGreaterThan(0.4);
    }
    expect(fractions[3].catchment.cloudFraction).toBeGreaterThan(0.1);
  }, 30_000);

  it('has a thinning map that draws the given profile band by band, within its noise', () => {
    const change = elevationChangeByBand({ kind: 'rate', dhdt: valley.elevationChange.dhdt }, derived.zones);
    const drawn = change.rows.filter((r) => r.coveredFraction > 0.5);
    expect(drawn.length).toBeGreaterThan(10);
    for (const row of drawn) {
      const given = thinning.find((t) => t.lowerM === row.lowerM)!.dhdtMPerYear;
      expect(Math.abs(row.dhdtMPerYear! - given), `band ${row.lowerM}–${row.upperM} m`).toBeLessThan(0.2);
    }
    expect(change.glacier.coveredFraction).toBeGreaterThan(0.6);
  });
});

function sameValues(a: Float32Array, b: Float32Array): boolean {
  return a.length === b.length && a.every((v, i) => Object.is(v, b[i]));
}
