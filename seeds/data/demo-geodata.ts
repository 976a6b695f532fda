import { encodeGeoTiff } from '../../server/services/geodata/geotiff-writer';
import { generateDemoValley } from '../../shared/geodata/demo/demo-valley';
import type { GeodataLayer } from '../../shared/schemas/geodata';
import { DEMO_BANDS, DEMO_CATCHMENT } from './demo-catchment';
import { demoThinning } from './demo-thinning';

/** One geodata file of the demo catchment as a user would upload it, with its form fields. */
export interface DemoGeodataFile {
  layer: GeodataLayer;
  fileName: string;
  bytes: Uint8Array;
  fields: Record<string, string>;
}

let cached: DemoGeodataFile[] | null = null;

/**
 * The invented Upper Sarvel valley's geodata files, generated the same way every time
 * (shared/geodata/demo/demo-valley.ts): a 30 m DEM (float32 GeoTIFF on UTM 44N), catchment, glacier
 * and debris outlines (GeoJSON), a debris-thickness raster, six classified snow-cover maps of 2024
 * and a 2000–2020 glacier thinning map consistent with the demo's hidden "true" run
 * (demo-thinning.ts). Nothing in them is measured.
 */
export function demoGeodataFiles(): DemoGeodataFile[] {
  if (cached) return cached;
  const valley = generateDemoValley(DEMO_BANDS, { latitudeDeg: DEMO_CATCHMENT.latitudeDeg, longitudeDeg: DEMO_CATCHMENT.longitudeDeg, thinning: demoThinning() });
  const json = (value: unknown) => new TextEncoder().encode(JSON.stringify(value));
  const codes = valley.snowClassCodes;
  const list = (values: number[]) => values.join(', ');
  cached = [
    { layer: 'dem', fileName: 'upper-sarvel-dem-30m.tif', bytes: encodeGeoTiff(valley.dem), fields: {} },
    { layer: 'catchmentOutline', fileName: 'upper-sarvel-catchment.geojson', bytes: json(valley.catchment), fields: {} },
    { layer: 'glacierOutline', fileName: 'sarvel-glaciers.geojson', bytes: json(valley.glaciers), fields: {} },
    { layer: 'debrisOutline', fileName: 'sarvel-debris-cover.geojson', bytes: json(valley.debris), fields: {} },
    { layer: 'debrisThickness', fileName: 'sarvel-debris-thickness.tif', bytes: encodeGeoTiff(valley.debrisThickness), fields: {} },
    ...valley.snowMaps.map((m): DemoGeodataFile => ({
      layer: 'snowCover', fileName: `sarvel-snow-${m.date}.tif`, bytes: encodeGeoTiff(m.raster, { type: 'uint8', nodata: 255 }),
      fields: { observedOn: m.date, snowCodes: list(codes.snow), noSnowCodes: list(codes.noSnow), cloudCodes: list(codes.cloud), nodataCodes: list(codes.nodata) },
    })),
    {
      layer: 'elevationChange', fileName: 'sarvel-thinning-2000-2020.tif', bytes: encodeGeoTiff(valley.elevationChange.dhdt),
      fields: { changeKind: 'rate', fromDate: valley.elevationChange.fromDate, toDate: valley.elevationChange.toDate },
    },
  ];
  return cached;
}
