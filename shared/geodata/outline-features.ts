import { MAX_OUTLINE_FEATURES, NAME_ATTRIBUTES } from '../schemas/outline-batches';
import type { Crs } from './crs';
import { GeodataError } from './errors';
import { checkLongitudeLatitude, checkPolygons, collectPolygons, geoJsonCrs, isObject, type Json, type Outline, type PolygonRings } from './outline';


/** One feature of a file of many outlines: each is to become a catchment of its own. */
export interface OutlineFeature {
  /** Position in the file, from 1 (GeoJSON features and shapefile records in their order). */
  number: number;
  /** The name attribute, trimmed; null when the feature has none. */
  name: string | null;
  /** The feature's polygons, checked; null when its geometry cannot be used (then `problem` says why). */
  outline: Outline | null;
  problem: string | null;
}

/**
 * Reads a GeoJSON FeatureCollection (or one Feature, or a bare geometry) as separate outlines, one
 * per feature, with the name each carries. A feature whose geometry is unusable (no polygon, a
 * ring that crosses itself, positions that are not longitude/latitude) is kept with its problem,
 * so every feature can be reported at once; only a file with no features at all is refused.
 */
export function outlineFeaturesFromGeoJson(json: unknown, field: string, crsOverride?: Crs): { crs: Crs; features: OutlineFeature[] } {
  if (!isObject(json)) throw new GeodataError('bad_geometry', 'The outline file is not GeoJSON (expected an object with "type").', field);
  const crs = crsOverride ?? geoJsonCrs(json, field);
  const nodes: Json[] = json.type === 'FeatureCollection' ? (Array.isArray(json.features) ? json.features.filter(isObject) : []) : [json];
  if (nodes.length === 0) throw new GeodataError('empty_outline', 'The outline file holds no features.', field);
  if (nodes.length > MAX_OUTLINE_FEATURES) {
    throw new GeodataError('too_large', `The outline file holds ${nodes.length.toLocaleString('en')} features; up to ${MAX_OUTLINE_FEATURES} outlines are read from one file. Split it into several uploads.`, field);
  }
  return { crs, features: nodes.map((node, i) => readFeature(node, i + 1, crs, field)) };
}

function readFeature(node: Json, number: number, crs: Crs, field: string): OutlineFeature {
  const name = featureName(isObject(node.properties) ? node.properties : {});
  try {
    const polygons: PolygonRings[] = [];
    collectPolygons(node, field, polygons, number);
    if (polygons.length === 0) return { number, name, outline: null, problem: 'It holds no polygon (points and lines cannot outline an area).' };
    if (crs.kind === 'geographic') checkLongitudeLatitude(polygons, field);
    checkPolygons(polygons, crs, field);
    return { number, name, outline: { polygons, crs }, problem: null };
  } catch (error) {
    if (error instanceof GeodataError) return { number, name, outline: null, problem: error.message };
    throw error;
  }
}

/** The feature's name: the first of NAME_ATTRIBUTES it has with a value, in any letter case. */
export function featureName(properties: Json): string | null {
  const keys = Object.keys(properties);
  for (const attribute of NAME_ATTRIBUTES) {
    const key = keys.find((k) => k.trim().toLowerCase() === attribute);
    const value = key === undefined ? undefined : properties[key];
    if ((typeof value === 'string' || typeof value === 'number') && String(value).trim() !== '') return String(value).trim();
  }
  return null;
}

/**
 * One outline as a GeoJSON Feature in its own system, as the catchment's outline file is kept:
 * positions exactly as read, and the system named in the `crs` member unless it is WGS 84
 * longitude/latitude (GeoJSON's default), so the file reads back to the same outline.
 */
export function outlineFeatureGeoJson(outline: Outline, name: string | null): Json {
  const feature: Json = { type: 'Feature', properties: name === null ? {} : { name }, geometry: { type: 'MultiPolygon', coordinates: outline.polygons } };
  if (outline.crs.epsg !== 4326) {
    feature.crs = { type: 'name', properties: { name: outline.crs.epsg ? `urn:ogc:def:crs:EPSG::${outline.crs.epsg}` : outline.crs.proj4 } };
  }
  return feature;
}
