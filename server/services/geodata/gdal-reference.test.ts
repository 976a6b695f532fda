import { readFileSync, writeFileSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { crsFromEpsg } from '../../../shared/geodata/crs';
import { deriveCatchment } from '../../../shared/geodata/derive';
import { outlineFromGeoJson } from '../../../shared/geodata/outline';
import { rasterizePolygons } from '../../../shared/geodata/rasterize';
import { pointTransform, warpRaster } from '../../../shared/geodata/reproject';
import { aspectDeg, hillshade, hornGradient, slopeDeg } from '../../../shared/geodata/terrain';
import type { Raster } from '../../../shared/geodata/raster';
import { readGeoTiffFile } from './geotiff-reader';
import { gdal, scratchFolder, testSurface, UTM44N } from './test-support/gdal';

/**
 * Reference checks against GDAL 3.6's own tools (Debian's gdal-bin) on small surfaces made here.
 * Tolerances (and why):
 *   slope, aspect         0.02°      both are Horn (1981) on the same cells; GDAL works in float32
 *   hillshade             ±1         GDAL approximates the division (ApproxADivByInvSqrtB) and rounds to a byte
 *   rasterised outline    identical  same cell-centre rule; outline vertices avoid cell centres
 *   bilinear warp         0.02 m     same bilinear kernel; GDAL run with -et 0 (exact transformer)
 *   reprojection          1 mm       proj4 against PROJ through gdaltransform
 *   zonal mean slope      0.01°      gdal_rasterize masks gdaldem's slope; gdalinfo -stats averages it
 */
const scratch = scratchFolder();
afterAll(() => scratch.dispose());

const SURFACES = ['plane', 'cone', 'paraboloid', 'mountain'] as const;

async function gdalRaster(file: string): Promise<Raster> {
  return (await readGeoTiffFile(file, { field: 'dem', categorical: true })).raster;
}

function interiorDifferences(ours: ArrayLike<number>, theirs: Raster, skipNaN = true): { worst: number; compared: number } {
  let worst = 0;
  let compared = 0;
  for (let r = 1; r < theirs.height - 1; r++) {
    for (let c = 1; c < theirs.width - 1; c++) {
      const i = r * theirs.width + c;
      const a = ours[i];
      const b = theirs.values[i];
      if (skipNaN && (a !== a || b !== b)) continue;
      worst = Math.max(worst, Math.abs(a - b));
      compared++;
    }
  }
  return { worst, compared };
}

describe('terrain against gdaldem (GDAL 3.6)', () => {
  for (const kind of SURFACES) {
    it(`slope, aspect and hillshade of the ${kind} match gdaldem's Horn method`, async () => {
      const dem = testSurface(kind);
      const file = scratch.write(`${kind}.tif`, dem);
      gdal('gdaldem', ['slope', '-q', '-compute_edges', file, scratch.path(`${kind}-slope.tif`)]);
      gdal('gdaldem', ['aspect', '-q', '-compute_edges', file, scratch.path(`${kind}-aspect.tif`)]);
      gdal('gdaldem', ['hillshade', '-q', '-compute_edges', file, scratch.path(`${kind}-shade.tif`)]);
      const g = hornGradient(dem.values, dem);
      const slope = Float32Array.from(g.east, (gx, i) => slopeDeg(gx, g.north[i]));
      const aspect = Float32Array.from(g.east, (gx, i) => aspectDeg(gx, g.north[i]));
      const theirSlope = await gdalRaster(scratch.path(`${kind}-slope.tif`));
      const theirAspect = await gdalRaster(scratch.path(`${kind}-aspect.tif`));
      const theirShade = await gdalRaster(scratch.path(`${kind}-shade.tif`));
      // edges too (-compute_edges extrapolates missing neighbours as we do), except the four corners, where GDAL's extrapolation differs
      let worstSlope = 0;
      for (let i = 0; i < slope.length; i++) {
        const r = Math.floor(i / dem.width);
        const c = i % dem.width;
        const corner = (r === 0 || r === dem.height - 1) && (c === 0 || c === dem.width - 1);
        if (!corner) worstSlope = Math.max(worstSlope, Math.abs(slope[i] - theirSlope.values[i]));
      }
      expect(worstSlope).toBeLessThan(0.02);
      const aspectDiff = interiorDifferences(aspect, theirAspect);
      const circular = Math.min(aspectDiff.worst, 360 - aspectDiff.worst);
      expect(aspectDiff.compared).toBeGreaterThan(100 * 90);
      expect(circular).toBeLessThan(0.02);
      const shade = hillshade(g);
      expect(interiorDifferences(shade, theirShade).worst).toBeLessThanOrEqual(1);
    });
  }
});

describe('outlines, warping and zonal statistics against GDAL', () => {
  const dem = testSurface('mountain');
  const demFile = scratch.write('zonal-dem.tif', dem);
  // a wobbly outline in UTM, vertices off the cell centres
  const ring: [number, number][] = Array.from({ length: 41 }, (_, k) => {
    const a = (2 * Math.PI * (k % 40)) / 40;
    const r = 1100 + 250 * Math.sin(3 * a) + 7.3;
    return [dem.x0 + 1800 + r * Math.cos(a) + 3.1, dem.y0 - 1500 + r * Math.sin(a) + 1.7];
  });
  const geojson = { type: 'FeatureCollection', crs: { type: 'name', properties: { name: 'urn:ogc:def:crs:EPSG::32644' } }, features: [{ type: 'Feature', properties: {}, geometry: { type: 'Polygon', coordinates: [ring] } }] };
  const outlineFile = scratch.path('outline.geojson');
  writeFileSync(outlineFile, JSON.stringify(geojson));
  const outline = outlineFromGeoJson(JSON.parse(readFileSync(outlineFile, 'utf8')), 'catchmentOutline');

  it('rasterises the outline to the same cells as gdal_rasterize', async () => {
    const maskFile = scratch.path('mask.tif');
    gdal('gdal_rasterize', ['-q', '-burn', '1', '-ot', 'Byte', '-init', '0', '-te', String(dem.x0), String(dem.y0 - dem.height * dem.dy), String(dem.x0 + dem.width * dem.dx), String(dem.y0), '-tr', '30', '30', outlineFile, maskFile]);
    const theirs = await gdalRaster(maskFile);
    const ours = rasterizePolygons(outline.polygons, dem);
    let differing = 0;
    let marked = 0;
    for (let i = 0; i < ours.length; i++) { if (ours[i] !== theirs.values[i]) differing++; marked += ours[i]; }
    expect(marked).toBeGreaterThan(3000);
    expect(differing).toBe(0);
  });

  it('mean slope and area inside the outline match gdaldem slope masked by gdal_rasterize (gdalinfo -stats)', async () => {
    const slopeFile = scratch.path('zonal-slope.tif');
    gdal('gdaldem', ['slope', '-q', '-compute_edges', demFile, slopeFile]);
    gdal('gdal_rasterize', ['-q', '-i', '-burn', '-9999', outlineFile, slopeFile]);
    const info = JSON.parse(gdal('gdalinfo', ['-json', '-stats', slopeFile])) as { bands: { mean: number; metadata: { '': Record<string, string> } }[] };
    const gdalMean = info.bands[0].mean;
    const validPercent = Number(info.bands[0].metadata['']['STATISTICS_VALID_PERCENT']);
    const derived = deriveCatchment({ dem, catchment: outline }, { bandWidthM: 100, horizonSectors: 0 });
    const cells = derived.units.reduce((s, u) => s + u.cells, 0);
    expect(cells).toBeCloseTo((validPercent / 100) * dem.width * dem.height, 0);
    // the area-weighted mean of the band slopes is the zonal mean (band slopes are rounded to 0.1°)
    const meanSlope = derived.bands.reduce((s, b) => s + b.slopeDeg * b.areaKm2, 0) / derived.bands.reduce((s, b) => s + b.areaKm2, 0);
    expect(Math.abs(meanSlope - gdalMean)).toBeLessThan(0.05 + 0.01);
    // planimetric area: cells × 900 m² on the UTM grid, shrunk by the scale factor (k ≈ 0.99963 at 60 km east of the central meridian)
    expect(derived.summary.areaKm2).toBeCloseTo((cells * 900) / 0.99963 ** 2 / 1e6, 3);
  });

  it('warps a longitude/latitude DEM to UTM like gdalwarp -r bilinear', async () => {
    const geographic = scratch.path('geographic.tif');
    gdal('gdalwarp', ['-q', '-overwrite', '-t_srs', 'EPSG:4326', '-r', 'bilinear', '-et', '0', demFile, geographic]);
    const source = await gdalRaster(geographic);
    // a finer target than the source, so gdalwarp's bilinear kernel keeps its plain 2 × 2 size
    const target = { x0: dem.x0 + 300, y0: dem.y0 - 300, dx: 20, dy: 20, width: 130, height: 100 };
    const back = scratch.path('back.tif');
    gdal('gdalwarp', ['-q', '-overwrite', '-t_srs', 'EPSG:32644', '-r', 'bilinear', '-et', '0', '-te', String(target.x0), String(target.y0 - target.height * 20), String(target.x0 + target.width * 20), String(target.y0), '-tr', '20', '20', geographic, back]);
    const theirs = await gdalRaster(back);
    const ours = warpRaster(source, target, UTM44N, 'bilinear');
    const { worst, compared } = interiorDifferences(ours.values, theirs);
    expect(compared).toBeGreaterThan(120 * 90);
    expect(worst).toBeLessThan(0.02);
  });

  it('transforms points as gdaltransform does (PROJ)', () => {
    const points = [[79.31, 33.94], [78.01, 30.5], [83.99, 36.2], [81, 0.01]];
    const lines = gdal('gdaltransform', ['-s_srs', 'EPSG:4326', '-t_srs', 'EPSG:32644', '-output_xy'], points.map((p) => `${p[0]} ${p[1]}`).join('\n')).trim().split('\n');
    const toUtm = pointTransform(crsFromEpsg(4326, 'dem'), UTM44N);
    points.forEach((p, k) => {
      const [gx, gy] = lines[k].trim().split(/\s+/).map(Number);
      const [x, y] = toUtm(p[0], p[1]);
      expect(Math.hypot(x - gx, y - gy)).toBeLessThan(0.001);
    });
  });
});


describe('GeoTIFFs written here, read by GDAL', () => {
  it.each(['float32', 'int16'] as const)('GDAL reads a %s GeoTIFF cell for cell (gdallocationinfo), nodata included', (type) => {
    const values = Float32Array.from([-120, 0, 3, 6500, NaN, 8848]);
    const file = scratch.write(`cells-${type}.tif`, { width: 3, height: 2, x0: 500_000, y0: 3_800_000, dx: 30, dy: 30, values, crs: UTM44N }, { type });
    const read = [0, 1, 2, 3, 4, 5].map((k) => Number(gdal('gdallocationinfo', ['-valonly', file, String(k % 3), String(Math.floor(k / 3))]).trim()));
    expect(read).toEqual([-120, 0, 3, 6500, -9999, 8848]);
  });
});
