import { crsFromEpsg, crsFromText, type Crs } from './crs';
import { GeodataError } from './errors';
import { findSelfIntersection } from './polygon-checks';
import type { PointTransform } from './reproject';

/** A ring of [x, y] positions, closed (last = first). */
export type Ring = [number, number][];
/** A polygon: its outer ring first, then its holes. */
export type PolygonRings = Ring[];

/** One outline input (catchment, glaciers or debris): any number of polygons in one system. */
export interface Outline {
  polygons: PolygonRings[];
  crs: Crs;
}

const LABELS: Record<string, string> = {
  catchmentOutline: 'catchment outline',
  glacierOutline: 'glacier outline',
  debrisOutline: 'debris-cover outline',
};
export const outlineLabel = (field: string): string => LABELS[field] ?? 'outline';

/** A parsed JSON object (GeoJSON member or node). */
export type Json = Record<string, unknown>;

/**
 * Reads GeoJSON (a FeatureCollection, a Feature or a bare geometry) holding Polygons and
 * MultiPolygons. Coordinates are longitude/latitude on WGS 84 (RFC 7946) unless the file names
 * another system in the older `crs` member. Checks every ring and refuses self-intersections.
 */
export function outlineFromGeoJson(json: unknown, field: string, crsOverride?: Crs): Outline {
  if (!isObject(json)) throw bad(field, 'is not GeoJSON (expected an object with "type").');
  const crs = crsOverride ?? geoJsonCrs(json, field);
  const polygons: PolygonRings[] = [];
  collectPolygons(json, field, polygons, 1);
  if (polygons.length === 0) {
    throw new GeodataError('empty_outline', `The ${outlineLabel(field)} holds no polygons (points and lines cannot outline an area).`, field);
  }
  if (crs.kind === 'geographic') checkLongitudeLatitude(polygons, field);
  checkPolygons(polygons, crs, field);
  return { polygons, crs };
}

/** The system a GeoJSON object names in the older `crs` member, else WGS 84 longitude/latitude (RFC 7946). */
export function geoJsonCrs(json: Json, field: string): Crs {
  const named = isObject(json.crs) && isObject(json.crs.properties) ? json.crs.properties.name : undefined;
  if (typeof named === 'string') return crsFromText(named, field);
  return crsFromEpsg(4326, field);
}

/** Adds the polygons of a GeoJSON object (collection, feature or geometry) to `out`; points and lines are passed over. `feature` numbers the messages. */
export function collectPolygons(node: Json, field: string, out: PolygonRings[], feature: number): void {
  switch (node.type) {
    case 'FeatureCollection': {
      const features = Array.isArray(node.features) ? node.features : [];
      features.forEach((f, i) => { if (isObject(f)) collectPolygons(f, field, out, i + 1); });
      return;
    }
    case 'Feature':
      if (isObject(node.geometry)) collectPolygons(node.geometry, field, out, feature);
      return;
    case 'GeometryCollection':
      (Array.isArray(node.geometries) ? node.geometries : []).forEach((g) => { if (isObject(g)) collectPolygons(g, field, out, feature); });
      return;
    case 'Polygon':
      out.push(readPolygon(node.coordinates, field, feature));
      return;
    case 'MultiPolygon':
      if (!Array.isArray(node.coordinates)) throw bad(field, `feature ${feature}: a MultiPolygon needs a list of polygons.`);
      for (const p of node.coordinates) out.push(readPolygon(p, field, feature));
      return;
    case 'Point': case 'MultiPoint': case 'LineString': case 'MultiLineString':
      return;
    default:
      throw bad(field, `feature ${feature}: "${String(node.type)}" is not a GeoJSON type.`);
  }
}

function readPolygon(coordinates: unknown, field: string, feature: number): PolygonRings {
  if (!Array.isArray(coordinates) || coordinates.length === 0) throw bad(field, `feature ${feature}: a Polygon needs at least its outer ring.`);
  return coordinates.map((ring, r) => readRing(ring, field, `feature ${feature}, ${r === 0 ? 'outer ring' : `hole ${r}`}`));
}

function readRing(ring: unknown, field: string, where: string): Ring {
  if (!Array.isArray(ring)) throw bad(field, `${where}: a ring must be a list of positions.`);
  const out: Ring = [];
  ring.forEach((p, i) => {
    if (!Array.isArray(p) || p.length < 2 || !Number.isFinite(p[0]) || !Number.isFinite(p[1])) {
      throw bad(field, `${where}, position ${i + 1}: expected two numbers [x, y], found ${JSON.stringify(p)?.slice(0, 40)}.`);
    }
    out.push([Number(p[0]), Number(p[1])]);
  });
  const [fx, fy] = out[0] ?? [NaN, NaN];
  const last = out[out.length - 1];
  if (out.length > 0 && (last[0] !== fx || last[1] !== fy)) out.push([fx, fy]);
  if (out.length < 4) throw bad(field, `${where}: a ring needs at least three distinct corners.`);
  return out;
}

/** Refuses positions that cannot be longitude and latitude (a projected file read as GeoJSON's default system). */
export function checkLongitudeLatitude(polygons: PolygonRings[], field: string): void {
  for (const polygon of polygons) {
    for (const [x, y] of polygon[0]) {
      if (Math.abs(x) > 180 || Math.abs(y) > 90) {
        throw new GeodataError('wrong_crs',
          `The ${outlineLabel(field)} has coordinates such as ${fmt(x)}, ${fmt(y)}, which are not longitude and latitude. ` +
          'GeoJSON is read as WGS 84 longitude/latitude unless it names its system; this file is probably in a projected system such as UTM. ' +
          'Export it as WGS 84 (EPSG:4326), or upload it as a zipped shapefile with its .prj file.', field, { x, y });
      }
    }
  }
}

/** Ring areas and self-intersections: the checks every outline passes whatever file it came from. */
export function checkPolygons(polygons: PolygonRings[], crs: Crs, field: string): void {
  polygons.forEach((polygon, p) => {
    const crossing = findSelfIntersection(polygon);
    if (crossing) {
      const unit = crs.kind === 'geographic' ? '° (longitude, latitude)' : ` ${crs.linearUnit}s (x, y)`;
      throw new GeodataError('self_intersection',
        `The ${outlineLabel(field)} crosses itself near ${fmt(crossing.x)}, ${fmt(crossing.y)}${unit}, in polygon ${p + 1} ` +
        `(${crossing.ringA === 0 ? 'outer ring' : `hole ${crossing.ringA}`} edge ${crossing.edgeA + 1} and ${crossing.ringB === 0 ? 'outer ring' : `hole ${crossing.ringB}`} edge ${crossing.edgeB + 1}). ` +
        'A polygon that crosses itself (a "bow-tie") has no clear inside; repair its geometry in your GIS and upload it again.',
        field, { x: crossing.x, y: crossing.y, polygon: p + 1 });
    }
    if (Math.abs(ringArea(polygon[0])) === 0) throw bad(field, `polygon ${p + 1}: the outer ring encloses no area.`);
  });
}

/** Signed area by the shoelace formula (positive when counter-clockwise), in squared CRS units. */
export function ringArea(ring: Ring): number {
  let twice = 0;
  for (let i = 0; i + 1 < ring.length; i++) twice += ring[i][0] * ring[i + 1][1] - ring[i + 1][0] * ring[i][1];
  return twice / 2;
}

/** Area of the outline (outer rings minus holes), in squared CRS units. */
export function outlineArea(polygons: PolygonRings[]): number {
  let area = 0;
  for (const polygon of polygons) polygon.forEach((ring, r) => { area += (r === 0 ? 1 : -1) * Math.abs(ringArea(ring)); });
  return area;
}

/** The outline's positions carried into another system (rings keep their shape; vertices are transformed one by one). */
export function transformOutline(outline: Outline, transform: PointTransform, crs: Crs): Outline {
  return { crs, polygons: outline.polygons.map((polygon) => polygon.map((ring) => ring.map(([x, y]) => transform(x, y)))) };
}

/** [minX, minY, maxX, maxY] of all positions. */
export function outlineBounds(polygons: PolygonRings[]): [number, number, number, number] {
  const b: [number, number, number, number] = [Infinity, Infinity, -Infinity, -Infinity];
  for (const polygon of polygons) for (const [x, y] of polygon[0]) {
    b[0] = Math.min(b[0], x); b[1] = Math.min(b[1], y); b[2] = Math.max(b[2], x); b[3] = Math.max(b[3], y);
  }
  return b;
}

export const isObject = (v: unknown): v is Json => typeof v === 'object' && v !== null && !Array.isArray(v);
const fmt = (v: number) => (Math.abs(v) >= 1000 ? v.toFixed(0) : v.toFixed(4));
const bad = (field: string, message: string) => new GeodataError('bad_geometry', `The ${outlineLabel(field)} ${message}`, field);
