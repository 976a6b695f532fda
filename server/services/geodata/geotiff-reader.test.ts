import { readFileSync, writeFileSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { GeodataError } from '../../../shared/geodata/errors';
import { readGeoTiff, readGeoTiffFile, type ReadGeoTiffOptions } from './geotiff-reader';
import { gdal, scratchFolder, testSurface } from './test-support/gdal';

const scratch = scratchFolder();
afterAll(() => scratch.dispose());

const dem = testSurface('mountain', 80, 60);
dem.values[5] = NaN;
const plain = scratch.write('plain.tif', dem);

async function refusal(file: string | Uint8Array, options: ReadGeoTiffOptions = { field: 'dem' }): Promise<GeodataError> {
  try {
    if (typeof file === 'string') await readGeoTiffFile(file, options); else await readGeoTiff(file, options);
  } catch (error) {
    if (error instanceof GeodataError) return error;
    throw error;
  }
  throw new Error('expected the file to be refused');
}

describe('reading GeoTIFF DEMs', () => {
  const variants: [string, string[]][] = [
    ['tiled, deflate', ['-co', 'TILED=YES', '-co', 'COMPRESS=DEFLATE', '-co', 'BLOCKXSIZE=32', '-co', 'BLOCKYSIZE=32']],
    ['stripped, LZW, 16-bit integers', ['-ot', 'Int16', '-co', 'COMPRESS=LZW']],
    ['stripped, deflate with floating-point predictor', ['-co', 'COMPRESS=DEFLATE', '-co', 'PREDICTOR=3']],
    ['BigTIFF', ['-co', 'BIGTIFF=YES']],
  ];
  for (const [label, options] of variants) {
    it(`reads a ${label} file written by gdal_translate with the same grid, system and values`, async () => {
      const file = scratch.path(`${label.replace(/\W+/g, '-')}.tif`);
      gdal('gdal_translate', ['-q', ...options, plain, file]);
      const { raster, info } = await readGeoTiffFile(file, { field: 'dem' });
      expect([raster.width, raster.height, raster.x0, raster.y0, raster.dx, raster.dy]).toEqual([dem.width, dem.height, dem.x0, dem.y0, dem.dx, dem.dy]);
      expect(raster.crs.epsg).toBe(32644);
      expect(raster.values[5]).toBeNaN();
      const integer = options.includes('Int16');
      let worst = 0;
      for (let i = 6; i < dem.values.length; i++) worst = Math.max(worst, Math.abs(raster.values[i] - dem.values[i]));
      expect(worst).toBeLessThanOrEqual(integer ? 0.5 : 0);
      expect(info.nodata).toBe(-9999);
    });
  }

  it('reads a "pixel is point" file to the same corners GDAL reports', async () => {
    const file = scratch.path('point.tif');
    gdal('gdal_translate', ['-q', '-mo', 'AREA_OR_POINT=Point', plain, file]);
    const gdalOrigin = (JSON.parse(gdal('gdalinfo', ['-json', file])) as { geoTransform: number[] }).geoTransform;
    const { raster } = await readGeoTiffFile(file, { field: 'dem' });
    expect(raster.x0).toBeCloseTo(gdalOrigin[0], 6);
    expect(raster.y0).toBeCloseTo(gdalOrigin[3], 6);
  });

  it('converts elevations stored in feet when told so', async () => {
    const { raster, info } = await readGeoTiffFile(plain, { field: 'dem', verticalUnit: 'foot' });
    expect(raster.values[100]).toBeCloseTo(dem.values[100] * 0.3048, 3);
    expect(info.notices.map((n) => n.code)).toContain('converted_from_feet');
  });
});

describe('malformed rasters give clear errors', () => {
  it('a truncated GeoTIFF says it is cut short', async () => {
    const bytes = readFileSync(plain);
    const error = await refusal(new Uint8Array(bytes.subarray(0, Math.floor(bytes.length / 2))));
    expect(error.code).toBe('truncated_file');
    expect(error.field).toBe('dem');
    expect(error.message).toMatch(/cut short/);
  });

  it('a header claiming 2 GB in a 200-byte file is refused before anything is read', async () => {
    const error = await refusal(tinyTiffClaiming(23_170, 23_170));
    expect(error.code).toBe('truncated_file');
    expect(error.message).toMatch(/23,170 × 23,170 cells, 2\.0 GB uncompressed/);
  });

  it('a raster over the cell limit is refused with its size', async () => {
    const error = await refusal(readFileSync(plain), { field: 'dem', maxCells: 1000 });
    expect(error.code).toBe('too_large');
    expect(error.message).toMatch(/80 × 60 cells/);
  });

  it('a TIFF without a coordinate system says so', async () => {
    const file = scratch.path('baseline.tif');
    gdal('gdal_translate', ['-q', '-co', 'PROFILE=BASELINE', plain, file]);
    const error = await refusal(file);
    expect(error.code).toBe('no_crs');
    expect(error.message).toMatch(/no coordinate system/);
  });

  it('a custom projection without an EPSG code asks for re-projection', async () => {
    const file = scratch.path('custom.tif');
    gdal('gdalwarp', ['-q', '-t_srs', '+proj=tmerc +lat_0=0 +lon_0=80 +k=1 +x_0=0 +y_0=0 +ellps=WGS84 +units=m', plain, file]);
    const error = await refusal(file);
    expect(error.code).toBe('unsupported_crs');
    expect(error.message).toMatch(/Re-project/);
  });

  it('a file that is not a TIFF names what it is', async () => {
    const png = scratch.path('image.tif');
    writeFileSync(png, Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0]));
    const error = await refusal(png);
    expect(error.code).toBe('not_a_geotiff');
    expect(error.message).toMatch(/PNG/);
  });
});

/**
 * A minimal little-endian TIFF (TIFF 6.0 baseline tags) whose header claims a float32 image of
 * width × height cells in one strip, but which holds no image data at all.
 */
function tinyTiffClaiming(width: number, height: number): Uint8Array {
  const tags: [number, number, number][] = [
    [256, 4, width], [257, 4, height], [258, 3, 32], [259, 3, 1], [262, 3, 1],
    [273, 4, 200], [277, 3, 1], [278, 4, height], [279, 4, width * height * 4], [339, 3, 3],
  ];
  const buffer = Buffer.alloc(200);
  buffer.write('II', 0, 'latin1');
  buffer.writeUInt16LE(42, 2);
  buffer.writeUInt32LE(8, 4);
  buffer.writeUInt16LE(tags.length, 8);
  tags.forEach(([tag, type, value], k) => {
    const at = 10 + k * 12;
    buffer.writeUInt16LE(tag, at);
    buffer.writeUInt16LE(type, at + 2);
    buffer.writeUInt32LE(1, at + 4);
    if (type === 3) buffer.writeUInt16LE(value, at + 8); else buffer.writeUInt32LE(value, at + 8);
  });
  return new Uint8Array(buffer);
}
