import { crsFromEpsg, isGroundMetric, METRES_PER_UNIT, utmCrsFor, type Crs } from './crs';
import { outlineBounds, type Outline } from './outline';
import { coveringGrid, pointTransform, warpRaster } from './reproject';
import type { GridGeometry, Raster } from './raster';

/** Terrain beyond the catchment kept for horizon searches (m): ridges further away rarely rise above a few degrees. */
export const HORIZON_MARGIN_M = 10_000;

const METRES_PER_DEGREE_LAT = 110_574;
const METRES_PER_DEGREE_LON_EQUATOR = 111_320;

/**
 * The grid all band statistics are computed on: square metric cells, north up. A DEM in a
 * metric projection (UTM and the like) is used as it is, cut to the catchment plus
 * `marginM`; one in longitude/latitude, in feet or in Web Mercator is resampled bilinearly onto
 * the UTM zone of the catchment's centre at about its own cell size, as `gdalwarp -r bilinear`
 * would.
 */
export function workingDem(dem: Raster, catchment: Outline, marginM = HORIZON_MARGIN_M): Raster {
  const centre = outlineCentreLonLat(catchment);
  if (isGroundMetric(dem.crs)) return cropToOutline(dem, catchment, marginM);
  const target = utmCrsFor(centre[0], centre[1]);
  const cellSize = cellSizeMetres(dem, centre[1]);
  const full = coveringGrid(dem, dem.crs, target, cellSize);
  const { geometry } = cropGeometry(full, outlineBoundsIn(catchment, target), marginM);
  return warpRaster(dem, geometry, target, 'bilinear');
}

/** Longitude and latitude (WGS 84) of the centre of the outline's bounding box. */
export function outlineCentreLonLat(outline: Outline): [number, number] {
  const [minX, minY, maxX, maxY] = outlineBounds(outline.polygons);
  return pointTransform(outline.crs, crsFromEpsg(4326, 'catchmentOutline'))((minX + maxX) / 2, (minY + maxY) / 2);
}

/** Size (m) of a square cell with about the area of the DEM's cells, rounded to 0.1 m. */
export function cellSizeMetres(dem: Raster, latitudeDeg: number): number {
  if (dem.crs.kind === 'geographic') {
    const dxM = dem.dx * METRES_PER_DEGREE_LON_EQUATOR * Math.cos((latitudeDeg * Math.PI) / 180);
    const dyM = dem.dy * METRES_PER_DEGREE_LAT;
    return Math.round(Math.sqrt(dxM * dyM) * 10) / 10;
  }
  const unit = METRES_PER_UNIT[dem.crs.linearUnit];
  const scale = dem.crs.epsg === 3857 ? Math.cos((latitudeDeg * Math.PI) / 180) : 1;
  return Math.round(Math.sqrt(dem.dx * dem.dy) * unit * scale * 10) / 10;
}

function outlineBoundsIn(outline: Outline, crs: Crs): [number, number, number, number] {
  const transform = pointTransform(outline.crs, crs);
  const b: [number, number, number, number] = [Infinity, Infinity, -Infinity, -Infinity];
  for (const polygon of outline.polygons) for (const [x, y] of polygon[0]) {
    const [tx, ty] = transform(x, y);
    b[0] = Math.min(b[0], tx); b[1] = Math.min(b[1], ty); b[2] = Math.max(b[2], tx); b[3] = Math.max(b[3], ty);
  }
  return b;
}

/** The part of `grid` within `margin` of the bounds, on the grid's own cell lines. */
function cropGeometry(grid: GridGeometry, bounds: [number, number, number, number], margin: number): { geometry: GridGeometry; col0: number; row0: number } {
  const [minX, minY, maxX, maxY] = bounds;
  const col0 = Math.max(0, Math.floor((minX - margin - grid.x0) / grid.dx));
  const col1 = Math.min(grid.width, Math.ceil((maxX + margin - grid.x0) / grid.dx));
  const row0 = Math.max(0, Math.floor((grid.y0 - maxY - margin) / grid.dy));
  const row1 = Math.min(grid.height, Math.ceil((grid.y0 - minY + margin) / grid.dy));
  const geometry = {
    dx: grid.dx, dy: grid.dy,
    width: Math.max(0, col1 - col0), height: Math.max(0, row1 - row0),
    x0: grid.x0 + col0 * grid.dx, y0: grid.y0 - row0 * grid.dy,
  };
  return { geometry, col0, row0 };
}

function cropToOutline(dem: Raster, outline: Outline, margin: number): Raster {
  const { geometry, col0, row0 } = cropGeometry(dem, outlineBoundsIn(outline, dem.crs), margin);
  if (geometry.width === dem.width && geometry.height === dem.height) return dem;
  const values = new Float32Array(geometry.width * geometry.height);
  for (let row = 0; row < geometry.height; row++) {
    const from = (row0 + row) * dem.width + col0;
    values.set(dem.values.subarray(from, from + geometry.width), row * geometry.width);
  }
  return { ...geometry, values, crs: dem.crs };
}

