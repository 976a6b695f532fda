import { utmCrsFor } from '../../../shared/geodata/crs';
import { checkElevationValues } from '../../../shared/geodata/dem-checks';
import { outlineArea, transformOutline, type Outline } from '../../../shared/geodata/outline';
import { validShare, type Raster } from '../../../shared/geodata/raster';
import { pointTransform } from '../../../shared/geodata/reproject';
import { outlineCentreLonLat } from '../../../shared/geodata/working-grid';
import type { GeodataLayer, UploadSummary } from '../../../shared/schemas/geodata';
import { formatNumber } from '../../../shared/text/numbers';
import { readGeoTiffFile } from './geotiff-reader';
import { readOutlineFile } from './outline-file';
import type { StoredFile } from './read-inputs';

const OUTLINES: readonly GeodataLayer[] = ['catchmentOutline', 'glacierOutline', 'debrisOutline'];

/**
 * Reads an uploaded file as the layer it was sent for and says what it holds, refusing with a
 * `GeodataError` what cannot be used (not a GeoTIFF, cut short, no coordinate system, a DEM in
 * feet, a bow-tie polygon, an empty shapefile, …). Runs in a worker thread: large rasters take seconds.
 */
export async function inspectUpload(layer: GeodataLayer, file: StoredFile, after?: StoredFile): Promise<UploadSummary> {
  if (OUTLINES.includes(layer)) return outlineSummary(await readOutlineFile(file.path, file.name, layer));
  const categorical = layer === 'snowCover' || layer === 'debrisThickness' || (layer === 'elevationChange' && !after);
  const { raster, info } = await readGeoTiffFile(file.path, { field: layer, categorical, verticalUnit: file.verticalUnit });
  if (layer === 'dem') checkElevationValues(raster);
  const summary = rasterSummary(raster, info.notices);
  if (after) {
    const second = await readGeoTiffFile(after.path, { field: 'elevationChangeAfter' });
    summary.facts.push(`second DEM: ${rasterSummary(second.raster, []).facts.join(', ')}`);
    summary.notices.push(...second.info.notices);
  }
  return summary;
}

/** What a raster holds, in a GIS user's words: its grid, its values and how much is nodata. */
export function rasterSummary(raster: Raster, notices: UploadSummary['notices']): UploadSummary {
  const unit = raster.crs.kind === 'geographic' ? '°' : ' m';
  const cell = raster.crs.kind === 'geographic' ? raster.dx.toPrecision(3) : formatNumber(raster.dx, 1);
  let min = Infinity;
  let max = -Infinity;
  for (const v of raster.values) if (v === v) { if (v < min) min = v; if (v > max) max = v; }
  const facts = [`${formatNumber(raster.width)} × ${formatNumber(raster.height)} cells of ${cell}${unit}`];
  if (min <= max) facts.push(`values ${formatNumber(min, 1)} to ${formatNumber(max, 1)}`);
  const missing = 1 - validShare(raster.values);
  if (missing > 0) facts.push(`${formatNumber(missing * 100, 1)} % nodata`);
  return { system: raster.crs.name, facts, notices: [...notices] };
}

/** What an outline holds: its polygons, holes, area (on the UTM zone of its centre) and centre. */
export function outlineSummary(outline: Outline): UploadSummary {
  const [lon, lat] = outlineCentreLonLat(outline);
  const utm = utmCrsFor(lon, lat);
  const metric = outline.crs.kind === 'geographic' ? transformOutline(outline, pointTransform(outline.crs, utm), utm) : outline;
  const holes = outline.polygons.reduce((n, p) => n + p.length - 1, 0);
  return {
    system: outline.crs.name,
    facts: [
      `${formatNumber(outline.polygons.length)} polygon(s)${holes > 0 ? ` with ${formatNumber(holes)} hole(s)` : ''}`,
      `${formatNumber(outlineArea(metric.polygons) / 1e6, 2)} km²`,
      `centre ${formatNumber(lat, 4)}° ${lat >= 0 ? 'N' : 'S'}, ${formatNumber(Math.abs(lon), 4)}° ${lon >= 0 ? 'E' : 'W'}`,
    ],
    notices: [],
  };
}
