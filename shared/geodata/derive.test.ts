import { describe, expect, it } from 'vitest';
import { bandTableSchema } from '../schemas/catchment-bands';
import { bandSchema } from '../melt/schema';
import { crsFromEpsg } from './crs';
import { deriveCatchment } from './derive';
import { pointTransform } from './reproject';
import { terrainFieldsSchema } from './terrain-fields';
import { boxOutline, coneDem, refusal } from './test-fixtures';
import type { Raster } from './raster';

const dem = coneDem();
const whole = boxOutline(15, 15, 5985, 5985, dem);

describe('bands from a DEM and outlines', () => {
  const derived = deriveCatchment({ dem, catchment: whole }, { bandWidthM: 200, horizonSectors: 8 });

  it('gives contiguous rows in the stored band schema plus the terrain fields', () => {
    expect(derived.bands[0].lowerM).toBe(3000);
    expect(derived.bands.at(-1)?.upperM).toBe(5000);
    derived.bands.forEach((band, i) => {
      expect(bandSchema.safeParse(band).success).toBe(true);
      expect(terrainFieldsSchema.safeParse(band).success).toBe(true);
      if (i > 0) expect(band.lowerM).toBe(derived.bands[i - 1].upperM);
      expect(band.horizonDeg).toHaveLength(8);
    });
  });

  it('areas add up to the outline and follow the cone: the band areas of z = top − k·r', () => {
    const total = derived.bands.reduce((s, b) => s + b.areaKm2, 0);
    expect(total).toBeCloseTo(derived.summary.areaKm2, 3);
    // UTM scale factor near 560 km east: areas are the grid's / k², k ≈ 0.99964
    expect(derived.summary.areaKm2).toBeCloseTo((5970 * 5970) / 1e6 / 0.99964 ** 2, 1);
    // the top band (4800–5000 m) is a disc of radius 300 m: π·0.3² km² (cone slope 2000 m over 3000 m)
    expect(derived.bands.at(-1)?.areaKm2).toBeCloseTo((Math.PI * 0.3 ** 2) / 0.99964 ** 2, 1);
    // slope of the cone: atan(2000/3000) = 33.69° away from the apex and the corner skirt
    expect(derived.bands[5].slopeDeg).toBeCloseTo(33.7, 0);
    expect(derived.summary.trueAreaKm2).toBeGreaterThan(derived.summary.areaKm2);
  });

  it('splits bands into north/east/south/west response units whose mean aspects fall in their class', () => {
    const split = deriveCatchment({ dem, catchment: whole }, { bandWidthM: 400, splitByAspect: true, horizonSectors: 0 });
    const classes = split.units.map((u) => u.aspectClass);
    expect(classes.slice(0, 4)).toEqual(['N', 'E', 'S', 'W']);
    split.units.forEach((unit, i) => {
      const aspect = split.bands[i].aspectDeg;
      const centre = { N: 0, E: 90, S: 180, W: 270 }[unit.aspectClass as 'N'];
      const off = Math.abs(((aspect - centre + 540) % 360) - 180);
      expect(off).toBeLessThan(45.01);
      expect(split.bands[i].skyViewFactor).toBeUndefined();
      expect(split.bands[i].aspectClass).toBe(unit.aspectClass);
    });
    // the rows are a valid band table: units of one band share its range, each with its own aspect class
    expect(bandTableSchema.safeParse(split.bands).success).toBe(true);
    const area = (d: typeof split) => d.bands.reduce((s, b) => s + b.areaKm2, 0);
    expect(area(split)).toBeCloseTo(area(derived), 2);
  });

  it('counts glacier and debris cover per band, debris as a share of the glacier', () => {
    // glacier: the northern half; debris: the northern quarter with a 0.3 m thickness
    const result = deriveCatchment(
      { dem, catchment: whole, glaciers: boxOutline(15, 15, 5985, 3000, dem), debris: boxOutline(15, 15, 5985, 1500, dem) },
      { bandWidthM: 200, horizonSectors: 0, debrisThicknessM: 0.3 },
    );
    const lowest = result.bands[0];
    expect(lowest.glacierFraction).toBeCloseTo(0.5, 1);
    expect(lowest.debrisFraction).toBeGreaterThan(0.5);
    expect(lowest.debrisThicknessM).toBe(0.3);
    expect(result.summary.glacierAreaKm2).toBeCloseTo(result.summary.areaKm2 / 2, 0);
    expect(result.hypsometry.reduce((s, h) => s + h.glacierAreaKm2, 0)).toBeCloseTo(result.summary.glacierAreaKm2, 6);
  });

  it('reads a DEM in longitude/latitude through its UTM zone', () => {
    const geographic = toGeographic(dem);
    const result = deriveCatchment({ dem: geographic, catchment: boxOutline(600, 600, 5400, 5400, dem) }, { bandWidthM: 200, horizonSectors: 0 });
    const direct = deriveCatchment({ dem, catchment: boxOutline(600, 600, 5400, 5400, dem) }, { bandWidthM: 200, horizonSectors: 0 });
    expect(result.summary.workingCrs).toBe('WGS 84 / UTM zone 44N');
    expect(result.summary.areaKm2).toBeCloseTo(direct.summary.areaKm2, 0);
    expect(Math.abs(result.bands[3].slopeDeg - direct.bands[3].slopeDeg)).toBeLessThan(1);
  });
});

describe('what a GIS user is told', () => {
  it('elevations higher than any summit are probably feet', () => {
    const feet = { ...dem, values: dem.values.map((v) => v * 3.2808) };
    const error = refusal(() => deriveCatchment({ dem: feet, catchment: whole }, { bandWidthM: 200 }));
    expect(error.code).toBe('dem_in_feet');
    expect(error.message).toMatch(/highest cell is 16,\d{3}, higher than any summit.*probably in feet \(4,98\d m/);
  });

  it('an outline off the DEM says how much lies outside', () => {
    const error = refusal(() => deriveCatchment({ dem, catchment: boxOutline(3000, 3000, 9000, 9000, dem) }, { bandWidthM: 200 }));
    expect(error.code).toBe('outside_dem');
    expect(error.message).toMatch(/75\.0 % of the catchment outline lies outside the DEM/);
    const far = refusal(() => deriveCatchment({ dem, catchment: boxOutline(90000, 90000, 95000, 95000, dem) }, { bandWidthM: 200 }));
    expect(far.message).toMatch(/entirely outside/);
  });

  it('nodata inside the outline is reported with its share, and refused when large', () => {
    const holed = { ...dem, values: dem.values.slice() };
    for (let r = 10; r < 20; r++) for (let c = 10; c < 20; c++) holed.values[r * dem.width + c] = NaN;
    const ok = deriveCatchment({ dem: holed, catchment: whole }, { bandWidthM: 200, horizonSectors: 0 });
    expect(ok.notices.find((n) => n.code === 'nodata_inside_outline')?.message).toMatch(/0\.3 % of the catchment \(100 cells, 0\.09 km²\)/);
    for (let i = 0; i < holed.values.length / 4; i++) holed.values[i] = NaN;
    const error = refusal(() => deriveCatchment({ dem: holed, catchment: whole }, { bandWidthM: 200 }));
    expect(error.code).toBe('too_much_nodata');
  });

  it('a DEM too coarse for the band width suggests a width it can resolve', () => {
    const coarse = coneDem(12, 500, 1000, 7000);
    const error = refusal(() => deriveCatchment({ dem: coarse, catchment: boxOutline(10, 10, 5990, 5990, coarse) }, { bandWidthM: 100 }));
    expect(error.code).toBe('dem_too_coarse');
    expect(error.field).toBe('bandWidthM');
    expect(error.message).toMatch(/bands of at least \d+ m/);
  });

  it('debris without a thickness, and impossible options, are refused by field', () => {
    expect(refusal(() => deriveCatchment({ dem, catchment: whole, glaciers: whole, debris: whole }, { bandWidthM: 200 })).field).toBe('debrisThicknessM');
    expect(refusal(() => deriveCatchment({ dem, catchment: whole }, { bandWidthM: 5 })).field).toBe('bandWidthM');
    expect(refusal(() => deriveCatchment({ dem, catchment: whole }, { bandWidthM: 200, horizonSectors: 100 })).field).toBe('horizonSectors');
  });

  it('debris off the glacier is left out and said so', () => {
    const result = deriveCatchment({ dem, catchment: whole, glaciers: boxOutline(15, 15, 5985, 3000, dem), debris: whole }, { bandWidthM: 200, horizonSectors: 0, debrisThicknessM: 0.1 });
    expect(result.notices.find((n) => n.code === 'debris_off_glacier')?.message).toMatch(/off the glacier/);
    expect(result.bands[0].debrisFraction).toBe(1);
  });
});

/** The DEM resampled onto longitude/latitude cells of about the same size (nearest cell centre). */
function toGeographic(source: Raster): Raster {
  const wgs84 = crsFromEpsg(4326, 'dem');
  const toLonLat = pointTransform(source.crs, wgs84);
  const toUtm = pointTransform(wgs84, source.crs);
  const [west, north] = toLonLat(source.x0, source.y0);
  const [east, south] = toLonLat(source.x0 + source.width * source.dx, source.y0 - source.height * source.dy);
  const d = 0.0003;
  const width = Math.ceil((east - west) / d);
  const height = Math.ceil((north - south) / d);
  const values = new Float32Array(width * height);
  for (let r = 0; r < height; r++) {
    for (let c = 0; c < width; c++) {
      const [x, y] = toUtm(west + (c + 0.5) * d, north - (r + 0.5) * d);
      const col = Math.floor((x - source.x0) / source.dx);
      const row = Math.floor((source.y0 - y) / source.dy);
      values[r * width + c] = col >= 0 && row >= 0 && col < source.width && row < source.height ? source.values[row * source.width + col] : NaN;
    }
  }
  return { width, height, x0: west, y0: north, dx: d, dy: d, values, crs: wgs84 };
}
