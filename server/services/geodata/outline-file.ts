import { open, readFile, stat } from 'node:fs/promises';
import type { Crs } from '../../../shared/geodata/crs';
import { GeodataError } from '../../../shared/geodata/errors';
import { outlineFromGeoJson, outlineLabel, type Outline } from '../../../shared/geodata/outline';
import { outlineFeaturesFromGeoJson, type OutlineFeature } from '../../../shared/geodata/outline-features';
import { GEODATA_LIMITS } from '../../../shared/geodata/limits';
import { readZippedShapefile } from './shapefile-reader';

/** Reads an uploaded outline file as one outline (every polygon of every feature). */
export async function readOutlineFile(path: string, originalName: string, field: string): Promise<Outline> {
  const { json, crs } = await readOutlineSource(path, originalName, field);
  return outlineFromGeoJson(json, field, crs);
}

/** Reads an uploaded outline file as separate outlines, one per feature, each with its name (see outline-features.ts). */
export async function readOutlineFeatures(path: string, originalName: string, field: string): Promise<{ crs: Crs; features: OutlineFeature[] }> {
  const { json, crs } = await readOutlineSource(path, originalName, field);
  return outlineFeaturesFromGeoJson(json, field, crs);
}

/**
 * An outline file as GeoJSON and the system a shapefile's .prj names: GeoJSON (.geojson/.json)
 * or a zipped shapefile (.zip), told apart by their first bytes rather than trusting the name.
 */
async function readOutlineSource(path: string, originalName: string, field: string): Promise<{ json: unknown; crs?: Crs }> {
  const { size } = await stat(path);
  if (size > GEODATA_LIMITS.outlineFileBytes) {
    throw new GeodataError('too_large', `The ${outlineLabel(field)} file is ${(size / 1024 ** 2).toFixed(1)} MB; up to ${GEODATA_LIMITS.outlineFileBytes / 1024 ** 2} MB are accepted.`, field);
  }
  if (size === 0) throw new GeodataError('empty_outline', `The ${outlineLabel(field)} file is empty.`, field);
  const head = Buffer.alloc(4);
  const handle = await open(path);
  try { await handle.read(head, 0, 4, 0); } finally { await handle.close(); }
  if (head.toString('latin1', 0, 2) === 'PK') return readZippedShapefile(path, field);
  if (/\.shp$/i.test(originalName)) {
    throw new GeodataError('bad_archive', 'Upload a shapefile as one .zip holding the .shp with its .dbf and .prj files.', field);
  }
  let json: unknown;
  try {
    json = JSON.parse((await readFile(path, 'utf8')).replace(/^\uFEFF/, ''));
  } catch (error) {
    const where = error instanceof SyntaxError ? ` (${error.message.replace(/^.*?JSON[^:]*:?\s*/i, '')})` : '';
    throw new GeodataError('bad_geometry', `The ${outlineLabel(field)} is neither GeoJSON nor a zipped shapefile: it could not be read as JSON${where}.`, field);
  }
  return { json };
}
