import { describe, expect, it } from 'vitest';
import { crsFromText } from './crs';
import { outlineFromGeoJson } from './outline';
import { MAX_OUTLINE_FEATURES } from '../schemas/outline-batches';
import { featureName, outlineFeatureGeoJson, outlineFeaturesFromGeoJson } from './outline-features';
import { refusal } from './test-fixtures';

const square = (x: number, y: number, s: number) => [[x, y], [x + s, y], [x + s, y + s], [x, y + s], [x, y]];
const feature = (properties: object, geometry: object | null) => ({ type: 'Feature', properties, geometry });

describe('a file of many outlines, feature by feature', () => {
  it('reads each feature as an outline of its own with its name, a MultiPolygon as one outline', () => {
    const { features, crs } = outlineFeaturesFromGeoJson({
      type: 'FeatureCollection',
      features: [
        feature({ name: ' West cirque ' }, { type: 'Polygon', coordinates: [square(79.3, 33.9, 0.02)] }),
        feature({ NAME: 'Two tongues' }, { type: 'MultiPolygon', coordinates: [[square(79.4, 33.9, 0.01)], [square(79.5, 33.9, 0.01)]] }),
      ],
    }, 'catchmentOutline');
    expect(crs.epsg).toBe(4326);
    expect(features.map((f) => [f.number, f.name, f.outline?.polygons.length, f.problem])).toEqual([[1, 'West cirque', 1, null], [2, 'Two tongues', 2, null]]);
  });

  it('keeps a feature whose geometry cannot be used, with its problem in words, beside the good ones', () => {
    const { features } = outlineFeaturesFromGeoJson({
      type: 'FeatureCollection',
      features: [
        feature({ name: 'Gauge' }, { type: 'Point', coordinates: [79.3, 33.9] }),
        feature({ name: 'Bow-tie' }, { type: 'Polygon', coordinates: [[[79, 33], [79.1, 33.1], [79.1, 33], [79, 33.1], [79, 33]]] }),
        feature({ name: 'Projected' }, { type: 'Polygon', coordinates: [square(560000, 3750000, 1000)] }),
        feature({}, { type: 'Polygon', coordinates: [square(79.3, 33.9, 0.02)] }),
        feature({ name: 'No geometry' }, null),
      ],
    }, 'catchmentOutline');
    expect(features[0].problem).toMatch(/no polygon/);
    expect(features[1].problem).toMatch(/crosses itself near 79\.0500, 33\.0500/);
    expect(features[2].problem).toMatch(/not longitude and latitude/);
    expect(features[3]).toMatchObject({ name: null, problem: null });
    expect(features[4].problem).toMatch(/no polygon/);
  });

  it('takes the name from name, catchment or catchment_name, in any letter case, numbers as text', () => {
    expect(featureName({ Catchment: 'Orvan headwater', id: 3 })).toBe('Orvan headwater');
    expect(featureName({ name: '', CATCHMENT_NAME: 'Upper Kesh' })).toBe('Upper Kesh');
    expect(featureName({ NAME: 17 })).toBe('17');
    expect(featureName({ label: 'Something' })).toBeNull();
  });

  it('refuses a file without features, or with more outlines than one upload makes catchments', () => {
    expect(refusal(() => outlineFeaturesFromGeoJson({ type: 'FeatureCollection', features: [] }, 'catchmentOutline')).code).toBe('empty_outline');
    const many = { type: 'FeatureCollection', features: Array.from({ length: MAX_OUTLINE_FEATURES + 1 }, () => feature({}, null)) };
    expect(refusal(() => outlineFeaturesFromGeoJson(many, 'catchmentOutline')).message).toMatch(/201 features; up to 200/);
  });

  it('writes one outline as GeoJSON that reads back to the same outline, in a projected system too', () => {
    const projected = outlineFeaturesFromGeoJson({
      type: 'FeatureCollection', crs: { type: 'name', properties: { name: 'EPSG:32644' } },
      features: [feature({ name: 'Utm' }, { type: 'Polygon', coordinates: [square(560000.25, 3750000.125, 1000)] })],
    }, 'catchmentOutline').features[0].outline!;
    const again = outlineFromGeoJson(JSON.parse(JSON.stringify(outlineFeatureGeoJson(projected, 'Utm'))), 'catchmentOutline');
    expect(again).toEqual(projected);
    // A system known only by its description (a shapefile's .prj) is written as that description.
    const wkt = crsFromText('+proj=utm +zone=44 +datum=WGS84 +units=m +no_defs', 'catchmentOutline');
    const custom = { polygons: projected.polygons, crs: wkt };
    expect(outlineFromGeoJson(outlineFeatureGeoJson(custom, null), 'catchmentOutline').crs.proj4).toBe(wkt.proj4);
    const lonLat = outlineFeaturesFromGeoJson(feature({ name: 'x' }, { type: 'Polygon', coordinates: [square(79.3, 33.9, 0.02)] }), 'catchmentOutline').features[0].outline!;
    expect(outlineFeatureGeoJson(lonLat, 'x').crs).toBeUndefined();
  });
});
