import * as shapefile from 'shapefile';
import { crsFromText } from '../../../shared/geodata/crs';
import { GeodataError } from '../../../shared/geodata/errors';
import type { Crs } from '../../../shared/geodata/crs';
import { outlineLabel } from '../../../shared/geodata/outline';
import { baseName, readZipEntries } from './zip-entries';

/** ESRI shape types that outline areas: Polygon, PolygonZ, PolygonM (ESRI Shapefile Technical Description, 1998). */
const POLYGON_TYPES = new Set([5, 15, 25]);
const SHAPE_NAMES: Record<number, string> = { 0: 'no shapes', 1: 'points', 3: 'lines', 8: 'multipoints', 11: 'points', 13: 'lines', 21: 'points', 23: 'lines', 28: 'multipoints', 31: 'multipatches' };

/**
 * Reads a zipped shapefile (.shp with its .dbf and .prj; .shx is not needed) as GeoJSON features
 * with their attributes, and the system its .prj gives; without a .prj the system is unknown and
 * the upload is refused. The .shp header is checked against the file before its shapes are parsed.
 */
export async function readZippedShapefile(path: string, field: string): Promise<{ json: unknown; crs: Crs }> {
  const entries = await readZipEntries(path, (name) => /\.(shp|dbf|prj|cpg)$/i.test(name) && !baseName(name).startsWith('._'), field);
  const shpNames = [...entries.keys()].filter((n) => /\.shp$/i.test(n));
  if (shpNames.length === 0) throw new GeodataError('bad_archive', 'The zip holds no shapefile (.shp). Zip the .shp together with its .dbf and .prj files.', field);
  if (shpNames.length > 1) {
    throw new GeodataError('bad_archive', `The zip holds ${shpNames.length} shapefiles (${shpNames.map(baseName).join(', ')}); upload one ${outlineLabel(field)} per zip.`, field);
  }
  const stem = shpNames[0].replace(/\.shp$/i, '');
  const sibling = (ext: string) => [...entries.entries()].find(([n]) => n.toLowerCase() === `${stem}.${ext}`.toLowerCase())?.[1];
  const shp = entries.get(shpNames[0]) as Buffer;
  checkShpHeader(shp, field);
  const prj = sibling('prj');
  if (!prj) {
    throw new GeodataError('no_crs', `The shapefile ${baseName(shpNames[0])} has no .prj file, so its coordinate system is unknown. Add the .prj that belongs to it to the zip.`, field);
  }
  const crs = crsFromText(prj.toString('utf8'), field);
  const dbf = sibling('dbf');
  let collection: unknown;
  try {
    collection = await shapefile.read(toArrayBuffer(shp), dbf ? toArrayBuffer(dbf) : undefined, { encoding: sibling('cpg')?.toString('latin1').trim() || 'utf-8' });
  } catch {
    throw new GeodataError('bad_archive', `The shapefile ${baseName(shpNames[0])} could not be read: it is damaged or cut short.`, field);
  }
  return { json: collection, crs };
}

function checkShpHeader(shp: Buffer, field: string): void {
  if (shp.length < 100 || shp.readInt32BE(0) !== 9994) {
    throw new GeodataError('bad_archive', 'The .shp file is not a shapefile (its header is missing or wrong).', field);
  }
  const declared = shp.readInt32BE(24) * 2;
  if (declared > shp.length) {
    throw new GeodataError('truncated_file', `The .shp file is cut short: its header says ${declared.toLocaleString('en')} bytes, but it has ${shp.length.toLocaleString('en')}.`, field, { claimedBytes: declared, fileBytes: shp.length });
  }
  const type = shp.readInt32LE(32);
  if (type === 0 || declared <= 100) throw new GeodataError('empty_outline', `The shapefile holds no shapes, so there is no ${outlineLabel(field)} to read.`, field);
  if (!POLYGON_TYPES.has(type)) {
    throw new GeodataError('bad_geometry', `The shapefile holds ${SHAPE_NAMES[type] ?? `shape type ${type}`}, not polygons; an outline must be polygons.`, field);
  }
}

const toArrayBuffer = (b: Buffer) => b.buffer.slice(b.byteOffset, b.byteOffset + b.byteLength) as ArrayBuffer;
