import { readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { GeodataError } from '../../../shared/geodata/errors';
import { outlineArea } from '../../../shared/geodata/outline';
import { readOutlineFile } from './outline-file';
import { scratchFolder, zippedShapefile } from './test-support/gdal';
import { storeZip } from './test-support/store-zip';

const scratch = scratchFolder();
afterAll(() => scratch.dispose());

/** A 2 × 1.5 km UTM square with a 500 m square hole, area 3 km² − 0.25 km². */
const square = {
  type: 'FeatureCollection',
  crs: { type: 'name', properties: { name: 'urn:ogc:def:crs:EPSG::32644' } },
  features: [{
    type: 'Feature', properties: { name: 'Test basin' },
    geometry: { type: 'Polygon', coordinates: [
      [[560000, 3750000], [562000, 3750000], [562000, 3751500], [560000, 3751500], [560000, 3750000]],
      [[560500, 3750500], [560500, 3751000], [561000, 3751000], [561000, 3750500], [560500, 3750500]],
    ] },
  }],
};


async function refusal(path: string, originalName: string): Promise<GeodataError> {
  try {
    await readOutlineFile(path, originalName, 'glacierOutline');
  } catch (error) {
    if (error instanceof GeodataError) return error;
    throw error;
  }
  throw new Error('expected the outline to be refused');
}

describe('outline files', () => {
  it('reads a zipped shapefile written by ogr2ogr, with its hole and its .prj system', async () => {
    const outline = await readOutlineFile(zippedShapefile(scratch, 'basin', square), 'basin.zip', 'catchmentOutline');
    expect(outline.crs.kind).toBe('projected');
    expect(outline.crs.linearUnit).toBe('metre');
    expect(outline.polygons).toHaveLength(1);
    expect(outline.polygons[0]).toHaveLength(2);
    expect(outlineArea(outline.polygons)).toBeCloseTo(3e6 - 0.25e6, 0);
  });

  it('reads GeoJSON', async () => {
    const file = scratch.path('basin.geojson');
    writeFileSync(file, JSON.stringify(square));
    const outline = await readOutlineFile(file, 'basin.geojson', 'catchmentOutline');
    expect(outline.crs.epsg).toBe(32644);
  });

  it('a shapefile without its .prj has no coordinate system', async () => {
    const error = await refusal(zippedShapefile(scratch, 'noprj', square, (f) => !f.endsWith('.prj')), 'noprj.zip');
    expect(error.code).toBe('no_crs');
    expect(error.message).toMatch(/no \.prj/);
  });

  it('an empty shapefile says it holds no shapes', async () => {
    const empty = { ...square, features: [] };
    const zip = zippedShapefile(scratch, 'empty', { ...empty, features: [] });
    const error = await refusal(zip, 'empty.zip');
    expect(error.code).toBe('empty_outline');
  });

  it('a shapefile of points is not an outline', async () => {
    const points = { ...square, features: [{ type: 'Feature', properties: { name: 'a' }, geometry: { type: 'Point', coordinates: [560000, 3750000] } }] };
    const error = await refusal(zippedShapefile(scratch, 'points', points), 'points.zip');
    expect(error.code).toBe('bad_geometry');
    expect(error.message).toMatch(/points, not polygons/);
  });

  it('a zip entry claiming 2 GB unpacked is refused before it is unpacked', async () => {
    const zip = scratch.path('bomb.zip');
    writeFileSync(zip, storeZip([{ name: 'big.shp', data: Buffer.alloc(4096), claimSize: 2 ** 31, deflate: true }]));
    const error = await refusal(zip, 'bomb.zip');
    expect(error.code).toBe('too_large');
    expect(error.message).toMatch(/claims 2048 MB/);
  });

  it('a damaged zip archive is refused', async () => {
    const zip = scratch.path('broken.zip');
    writeFileSync(zip, Buffer.concat([Buffer.from('PK\u0003\u0004'), Buffer.alloc(64, 7)]));
    expect((await refusal(zip, 'broken.zip')).code).toBe('bad_archive');
  });

  it('a cut-short .shp inside the zip is refused with its sizes', async () => {
    const zip = zippedShapefile(scratch, 'cut', square);
    const shp = readdirSync(scratch.path('cut-parts')).find((f) => f.endsWith('.shp')) as string;
    const parts = readdirSync(scratch.path('cut-parts')).map((f) => {
      const data = readFileSync(scratch.path(`cut-parts/${f}`));
      return { name: f, data: f === shp ? data.subarray(0, 120) : data };
    });
    writeFileSync(zip, storeZip(parts));
    const error = await refusal(zip, 'cut.zip');
    expect(error.code).toBe('truncated_file');
  });

  it('a lone .shp and text that is not JSON get a hint', async () => {
    const shp = scratch.path('alone.shp');
    writeFileSync(shp, Buffer.alloc(120));
    expect((await refusal(shp, 'alone.shp')).message).toMatch(/one \.zip/);
    const text = scratch.path('notes.geojson');
    writeFileSync(text, 'glacier outline, see attached');
    expect((await refusal(text, 'notes.geojson')).message).toMatch(/neither GeoJSON nor a zipped shapefile/);
  });
});
