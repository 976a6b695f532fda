import proj4 from 'proj4';
import { GeodataError } from './errors';

/**
 * A coordinate reference system: what the file said (EPSG code, or a WKT/proj4 text) turned into a
 * proj4 definition. `linearUnit` is the unit of the coordinates (degrees for geographic systems).
 */
export interface Crs {
  name: string;
  epsg?: number;
  proj4: string;
  kind: 'geographic' | 'projected';
  linearUnit: 'degree' | 'metre' | 'foot' | 'us-foot';
}

const FOOT_M = 0.3048;
const US_FOOT_M = 1200 / 3937;
/** Metres per unit of a linear unit. */
export const METRES_PER_UNIT = { degree: NaN, metre: 1, foot: FOOT_M, 'us-foot': US_FOOT_M } as const;

/** EPSG unit-of-measure codes used by GeoTIFF keys (EPSG registry, common practice). */
export const EPSG_UNITS: Record<number, Crs['linearUnit']> = { 9001: 'metre', 9002: 'foot', 9003: 'us-foot', 9102: 'degree' };

const GEOGRAPHIC: Record<number, { name: string; proj4: string }> = {
  4326: { name: 'WGS 84 (longitude/latitude)', proj4: '+proj=longlat +datum=WGS84 +no_defs' },
  4269: { name: 'NAD83 (longitude/latitude)', proj4: '+proj=longlat +datum=NAD83 +no_defs' },
  4258: { name: 'ETRS89 (longitude/latitude)', proj4: '+proj=longlat +ellps=GRS80 +towgs84=0,0,0,0,0,0,0 +no_defs' },
  4490: { name: 'China Geodetic Coordinate System 2000 (longitude/latitude)', proj4: '+proj=longlat +ellps=GRS80 +no_defs' },
};

/**
 * The systems Tarnish knows by EPSG code: the common geographic ones, UTM on WGS 84 (326zz north,
 * 327zz south), on ETRS89 (258zz) and on NAD83 (269zz), and Web Mercator (3857).
 */
export function crsFromEpsg(code: number, field: string): Crs {
  const geographic = GEOGRAPHIC[code];
  if (geographic) return { ...geographic, epsg: code, kind: 'geographic', linearUnit: 'degree' };
  const utm = utmFromEpsg(code);
  if (utm) return { ...utm, epsg: code, kind: 'projected', linearUnit: 'metre' };
  if (code === 3857) {
    return {
      name: 'Web Mercator', epsg: code, kind: 'projected', linearUnit: 'metre',
      proj4: '+proj=merc +a=6378137 +b=6378137 +lat_ts=0 +lon_0=0 +x_0=0 +y_0=0 +k=1 +units=m +nadgrids=@null +no_defs',
    };
  }
  throw new GeodataError('unsupported_crs',
    `The coordinate system EPSG:${code} is not one Tarnish reads. Re-project the file to longitude/latitude (EPSG:4326) or to a UTM zone (e.g. EPSG:32644) and upload it again.`,
    field, { epsg: code });
}

function utmFromEpsg(code: number): { name: string; proj4: string } | null {
  const families = [
    { base: 32600, zones: 60, south: false, datum: '+datum=WGS84', label: 'WGS 84' },
    { base: 32700, zones: 60, south: true, datum: '+datum=WGS84', label: 'WGS 84' },
    { base: 25800, zones: 60, south: false, datum: '+ellps=GRS80 +towgs84=0,0,0,0,0,0,0', label: 'ETRS89', first: 28, last: 38 },
    { base: 26900, zones: 23, south: false, datum: '+datum=NAD83', label: 'NAD83' },
  ];
  for (const f of families) {
    const zone = code - f.base;
    const first = f.first ?? 1;
    const last = f.last ?? f.zones;
    if (zone >= first && zone <= last) {
      return {
        name: `${f.label} / UTM zone ${zone}${f.south ? 'S' : 'N'}`,
        proj4: `+proj=utm +zone=${zone}${f.south ? ' +south' : ''} ${f.datum} +units=m +no_defs`,
      };
    }
  }
  return null;
}

/** The WGS 84 UTM zone a point falls in (standard 6° zones; the Norway/Svalbard exceptions are ignored). */
export function utmCrsFor(longitudeDeg: number, latitudeDeg: number): Crs {
  const zone = Math.min(60, Math.max(1, Math.floor((longitudeDeg + 180) / 6) + 1));
  return crsFromEpsg((latitudeDeg >= 0 ? 32600 : 32700) + zone, 'dem');
}

/**
 * A system given as text: WKT (a shapefile's .prj), a proj4 string, or "EPSG:n" / an OGC URN
 * ("urn:ogc:def:crs:EPSG::32644", as older GeoJSON writes it).
 */
export function crsFromText(text: string, field: string): Crs {
  const trimmed = text.trim();
  const epsg = /EPSG:{1,2}(\d{4,5})$/i.exec(trimmed);
  if (epsg) return crsFromEpsg(Number(epsg[1]), field);
  if (/CRS84$/i.test(trimmed)) return crsFromEpsg(4326, field);
  let parsed: { projName?: string; units?: string; to_meter?: number };
  try {
    parsed = proj4.Proj(trimmed) as unknown as typeof parsed;
  } catch {
    parsed = {};
  }
  if (!parsed.projName) {
    throw new GeodataError('unsupported_crs',
      'The coordinate system description could not be read. Save the file again with an EPSG code (e.g. EPSG:4326 or a UTM zone such as EPSG:32644).',
      field);
  }
  const geographic = parsed.projName === 'longlat';
  const toMetre = parsed.to_meter ?? 1;
  const linearUnit: Crs['linearUnit'] = geographic ? 'degree'
    : Math.abs(toMetre - FOOT_M) < 1e-6 ? 'foot' : Math.abs(toMetre - US_FOOT_M) < 1e-6 ? 'us-foot' : 'metre';
  const name = /^(?:PROJCS|GEOGCS|PROJCRS|GEOGCRS)\["([^"]+)"/.exec(trimmed)?.[1]?.replace(/_/g, ' ') ?? trimmed.slice(0, 60);
  return { name, proj4: trimmed, kind: geographic ? 'geographic' : 'projected', linearUnit };
}

/** True when the grid's cells are metres on the ground without large scale distortion (so slopes and areas can be read directly). */
export function isGroundMetric(crs: Crs): boolean {
  return crs.kind === 'projected' && crs.linearUnit === 'metre' && crs.epsg !== 3857 && !/\+proj=merc/.test(crs.proj4);
}

/** GeoTIFF key values that mean "user-defined" rather than an EPSG code (GeoTIFF 1.0 spec). */
const USER_DEFINED = 32767;
const WGS84_DATUM = 6326;

/**
 * The system a GeoTIFF's keys describe (GeoTIFF 1.0: GTModelTypeGeoKey 1 = projected,
 * 2 = geographic; ProjectedCSTypeGeoKey / GeographicTypeGeoKey give the EPSG code). A
 * user-defined geographic system on the WGS 84 datum is read as EPSG:4326; other user-defined
 * systems are refused with a hint to re-project.
 */
export function crsFromGeoKeys(keys: Record<string, unknown> | null, field: string): Crs {
  const model = keys?.GTModelTypeGeoKey;
  const projected = Number(keys?.ProjectedCSTypeGeoKey);
  const geographic = Number(keys?.GeographicTypeGeoKey);
  if (!keys || (model === undefined && !projected && !geographic)) {
    throw new GeodataError('no_crs',
      'The GeoTIFF has no coordinate system (no GeoTIFF keys). Assign its coordinate system in your GIS (e.g. EPSG:4326 or the UTM zone it was made in) and export it again.',
      field);
  }
  if (model === 1 || (model === undefined && projected)) {
    if (!projected || projected === USER_DEFINED) {
      throw new GeodataError('unsupported_crs',
        'The GeoTIFF uses a custom projection without an EPSG code. Re-project it to a UTM zone (e.g. EPSG:32644) or to longitude/latitude (EPSG:4326) and upload it again.',
        field);
    }
    return crsFromEpsg(projected, field);
  }
  if (model === 2 || (model === undefined && geographic)) {
    if (geographic === USER_DEFINED && Number(keys.GeogGeodeticDatumGeoKey) === WGS84_DATUM) return crsFromEpsg(4326, field);
    if (!geographic || geographic === USER_DEFINED) {
      throw new GeodataError('unsupported_crs', 'The GeoTIFF uses a custom geographic system without an EPSG code. Re-project it to WGS 84 (EPSG:4326) and upload it again.', field);
    }
    return crsFromEpsg(geographic, field);
  }
  throw new GeodataError('unsupported_crs', 'The GeoTIFF is in a geocentric or unknown model type; Tarnish reads geographic and projected grids only.', field);
}
