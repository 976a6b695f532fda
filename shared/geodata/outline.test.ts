import { describe, expect, it } from 'vitest';
import { crsFromGeoKeys, crsFromText } from './crs';
import { outlineArea, outlineFromGeoJson } from './outline';
import { refusal } from './test-fixtures';

const square = (x: number, y: number, s: number) => [[x, y], [x + s, y], [x + s, y + s], [x, y + s], [x, y]];

describe('outlines from GeoJSON', () => {
  it('reads Polygons with holes and MultiPolygons from features, in longitude/latitude by default', () => {
    const outline = outlineFromGeoJson({
      type: 'FeatureCollection',
      features: [
        { type: 'Feature', properties: {}, geometry: { type: 'Polygon', coordinates: [square(79.3, 33.9, 0.02), square(79.305, 33.905, 0.005).reverse()] } },
        { type: 'Feature', properties: {}, geometry: { type: 'MultiPolygon', coordinates: [[square(79.4, 33.9, 0.01)], [square(79.5, 33.9, 0.01)]] } },
        { type: 'Feature', properties: {}, geometry: { type: 'Point', coordinates: [79.3, 33.9] } },
      ],
    }, 'glacierOutline');
    expect(outline.crs.epsg).toBe(4326);
    expect(outline.polygons).toHaveLength(3);
    expect(outline.polygons[0]).toHaveLength(2);
    expect(outlineArea(outline.polygons)).toBeCloseTo(0.02 ** 2 - 0.005 ** 2 + 2 * 0.01 ** 2, 10);
  });

  it('closes an open ring and takes the system an older "crs" member names', () => {
    const outline = outlineFromGeoJson({ type: 'Polygon', crs: { type: 'name', properties: { name: 'urn:ogc:def:crs:EPSG::32644' } }, coordinates: [square(560000, 3750000, 1000).slice(0, 4)] }, 'catchmentOutline');
    expect(outline.crs.epsg).toBe(32644);
    expect(outline.polygons[0][0]).toHaveLength(5);
  });

  it('a bow-tie polygon is refused with where it crosses itself', () => {
    const error = refusal(() => outlineFromGeoJson({ type: 'Polygon', coordinates: [[[79, 33], [79.1, 33.1], [79.1, 33], [79, 33.1], [79, 33]]] }, 'catchmentOutline'));
    expect(error.code).toBe('self_intersection');
    expect(error.message).toMatch(/crosses itself near 79\.0500, 33\.0500/);
    expect(error.field).toBe('catchmentOutline');
  });

  it('a hole that crosses its outer ring is refused', () => {
    const error = refusal(() => outlineFromGeoJson({ type: 'Polygon', coordinates: [square(79, 33, 0.1), square(79.05, 33.05, 0.1)] }, 'glacierOutline'));
    expect(error.code).toBe('self_intersection');
    expect(error.message).toMatch(/outer ring edge \d and hole 1 edge \d/);
  });

  it('rings that touch at one corner are allowed (two glaciers meeting at a point)', () => {
    expect(() => outlineFromGeoJson({ type: 'MultiPolygon', coordinates: [[square(79, 33, 0.1)], [square(79.1, 33.1, 0.1)]] }, 'glacierOutline')).not.toThrow();
  });

  it('projected coordinates without a named system are refused as not longitude/latitude', () => {
    const error = refusal(() => outlineFromGeoJson({ type: 'Polygon', coordinates: [square(476520, 3756300, 1000)] }, 'catchmentOutline'));
    expect(error.code).toBe('wrong_crs');
    expect(error.message).toMatch(/476520, 3756300.*not longitude and latitude/);
  });

  it('empty, malformed and degenerate outlines are refused', () => {
    expect(refusal(() => outlineFromGeoJson({ type: 'FeatureCollection', features: [] }, 'debrisOutline')).code).toBe('empty_outline');
    expect(refusal(() => outlineFromGeoJson({ type: 'Polygon', coordinates: [[[79, 33], [79.1, 'x'], [79, 33.1]]] }, 'debrisOutline')).message).toMatch(/position 2: expected two numbers/);
    expect(refusal(() => outlineFromGeoJson({ type: 'Polygon', coordinates: [[[79, 33], [79.1, 33], [79.2, 33], [79, 33]]] }, 'debrisOutline')).message).toMatch(/encloses no area/);
    expect(refusal(() => outlineFromGeoJson('glacier', 'debrisOutline')).code).toBe('bad_geometry');
  });
});

describe('coordinate systems', () => {
  it('reads GeoTIFF keys for geographic and UTM grids and refuses missing or custom ones', () => {
    expect(crsFromGeoKeys({ GTModelTypeGeoKey: 2, GeographicTypeGeoKey: 4326 }, 'dem').kind).toBe('geographic');
    expect(crsFromGeoKeys({ GTModelTypeGeoKey: 1, ProjectedCSTypeGeoKey: 32744 }, 'dem').proj4).toMatch(/\+zone=44 \+south/);
    expect(crsFromGeoKeys({ GTModelTypeGeoKey: 2, GeographicTypeGeoKey: 32767, GeogGeodeticDatumGeoKey: 6326 }, 'dem').epsg).toBe(4326);
    expect(refusalCode(() => crsFromGeoKeys(null, 'dem'))).toBe('no_crs');
    expect(refusalCode(() => crsFromGeoKeys({ GTModelTypeGeoKey: 1, ProjectedCSTypeGeoKey: 32767 }, 'dem'))).toBe('unsupported_crs');
    expect(refusalCode(() => crsFromGeoKeys({ GTModelTypeGeoKey: 1, ProjectedCSTypeGeoKey: 2193 }, 'dem'))).toBe('unsupported_crs');
  });

  it('reads the ESRI WKT a shapefile .prj holds', () => {
    const crs = crsFromText('PROJCS["WGS_1984_UTM_Zone_44N",GEOGCS["GCS_WGS_1984",DATUM["D_WGS_1984",SPHEROID["WGS_1984",6378137.0,298.257223563]],PRIMEM["Greenwich",0.0],UNIT["Degree",0.0174532925199433]],PROJECTION["Transverse_Mercator"],PARAMETER["False_Easting",500000.0],PARAMETER["False_Northing",0.0],PARAMETER["Central_Meridian",81.0],PARAMETER["Scale_Factor",0.9996],PARAMETER["Latitude_Of_Origin",0.0],UNIT["Meter",1.0]]', 'glacierOutline');
    expect(crs).toMatchObject({ kind: 'projected', linearUnit: 'metre', name: 'WGS 1984 UTM Zone 44N' });
    expect(refusalCode(() => crsFromText('nonsense', 'glacierOutline'))).toBe('unsupported_crs');
  });
});

function refusalCode(run: () => unknown): string {
  return refusal(run).code;
}
