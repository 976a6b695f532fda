import { GeodataError, percent, type GeodataNotice } from './errors';
import { outlineArea, outlineLabel, transformOutline, type Outline, type Ring } from './outline';
import { gridBounds, type GridGeometry, type Raster } from './raster';
import { pointTransform } from './reproject';

/** Highest summit on Earth in metres (8849 m, 2020 survey) plus a margin for DEM noise. */
const HIGHEST_PLAUSIBLE_M = 8_900;

/** Refuses a DEM whose values cannot be metres above sea level: empty, or higher than any summit (then probably feet). */
export function checkElevationValues(dem: Raster): void {
  let max = -Infinity;
  let valid = 0;
  for (let i = 0; i < dem.values.length; i++) {
    const v = dem.values[i];
    if (v === v) { valid++; if (v > max) max = v; }
  }
  if (valid === 0) throw new GeodataError('too_much_nodata', 'The DEM holds no elevations at all: every cell is nodata.', 'dem');
  if (max > HIGHEST_PLAUSIBLE_M) {
    throw new GeodataError('dem_in_feet',
      `The DEM's highest cell is ${Math.round(max).toLocaleString('en')}, higher than any summit on Earth in metres (8,849 m). ` +
      `The elevations are probably in feet (${Math.round(max * 0.3048).toLocaleString('en')} m if so): choose feet as the vertical unit, or convert the DEM to metres.`,
      'dem', { maxValue: max });
  }
}

/**
 * Share of the outline's area that lies outside the DEM's extent, measured in the DEM's own
 * system by clipping every ring to the DEM's rectangle (Sutherland & Hodgman 1974).
 */
export function shareOutsideDem(outline: Outline, dem: Raster): number {
  const inDem = dem.crs.proj4 === outline.crs.proj4 ? outline : transformOutline(outline, pointTransform(outline.crs, dem.crs), dem.crs);
  const total = outlineArea(inDem.polygons);
  const bounds = gridBounds(dem);
  const clipped = outlineArea(inDem.polygons.map((polygon) => polygon.map((ring) => clipRing(ring, bounds))));
  return total > 0 ? Math.max(0, 1 - clipped / total) : 1;
}

/** Errors when more than 1 % of an outline is off the DEM; a notice for a sliver. */
export function checkOutlineOnDem(outline: Outline, dem: Raster, field: string, notices: GeodataNotice[]): void {
  const outside = shareOutsideDem(outline, dem);
  if (outside >= 0.999) {
    throw new GeodataError('outside_dem',
      `The ${outlineLabel(field)} lies entirely outside the DEM. Check that both are in the coordinate systems their files say, and that the DEM covers the catchment.`,
      field, { outsideShare: outside });
  }
  if (outside > 0.01) {
    throw new GeodataError('outside_dem',
      `${percent(outside)} of the ${outlineLabel(field)} lies outside the DEM, so the bands would miss that area. Use a DEM that covers the whole outline.`,
      field, { outsideShare: outside });
  }
  if (outside > 0.0001) {
    notices.push({ code: 'outline_edge_outside_dem', field, message: `${percent(outside)} of the ${outlineLabel(field)} lies just outside the DEM and is left out.` });
  }
}

function clipRing(ring: Ring, [minX, minY, maxX, maxY]: [number, number, number, number]): Ring {
  let points = ring.slice(0, -1);
  const edges: [(p: [number, number]) => boolean, (a: [number, number], b: [number, number]) => [number, number]][] = [
    [(p) => p[0] >= minX, (a, b) => [minX, a[1] + ((minX - a[0]) / (b[0] - a[0])) * (b[1] - a[1])]],
    [(p) => p[0] <= maxX, (a, b) => [maxX, a[1] + ((maxX - a[0]) / (b[0] - a[0])) * (b[1] - a[1])]],
    [(p) => p[1] >= minY, (a, b) => [a[0] + ((minY - a[1]) / (b[1] - a[1])) * (b[0] - a[0]), minY]],
    [(p) => p[1] <= maxY, (a, b) => [a[0] + ((maxY - a[1]) / (b[1] - a[1])) * (b[0] - a[0]), maxY]],
  ];
  for (const [inside, cut] of edges) {
    const next: [number, number][] = [];
    for (let i = 0; i < points.length; i++) {
      const current = points[i];
      const previous = points[(i + points.length - 1) % points.length];
      if (inside(current)) {
        if (!inside(previous)) next.push(cut(previous, current));
        next.push(current);
      } else if (inside(previous)) {
        next.push(cut(previous, current));
      }
    }
    points = next;
    if (points.length === 0) return [];
  }
  return [...points, points[0]];
}

/** Nodata cells inside the catchment: an error above `maxShare`, otherwise a notice saying how much. */
export function checkNodataInside(z: Float32Array, mask: Uint8Array, grid: GridGeometry, maxShare: number, notices: GeodataNotice[]): { missing: number; total: number } {
  let total = 0;
  let missing = 0;
  for (let i = 0; i < mask.length; i++) {
    if (!mask[i]) continue;
    total++;
    if (z[i] !== z[i]) missing++;
  }
  if (total === 0) {
    throw new GeodataError('outside_dem', 'The catchment outline covers no DEM cell: it is smaller than one cell or lies outside the DEM.', 'catchmentOutline');
  }
  const share = missing / total;
  const km2 = (missing * grid.dx * grid.dy) / 1e6;
  const what = `${percent(share)} of the catchment (${missing.toLocaleString('en')} cells, ${km2.toFixed(2)} km²) has no elevation in the DEM (nodata)`;
  if (share > maxShare) {
    throw new GeodataError('too_much_nodata', `${what}, more than the ${percent(maxShare)} allowed. Fill the voids (e.g. from another DEM) and upload it again.`, 'dem', { missingCells: missing, share });
  }
  if (missing > 0) notices.push({ code: 'nodata_inside_outline', field: 'dem', message: `${what}; those cells are left out of the bands.` });
  return { missing, total };
}

/**
 * Refuses a band width the DEM cannot resolve: when neighbouring cells inside the catchment
 * typically differ by more than half a band, most cells' band is decided by the grid, not the
 * terrain (a rule of thumb of ours).
 */
export function checkResolution(z: Float32Array, mask: Uint8Array, grid: GridGeometry, bandWidthM: number): void {
  const steps: number[] = [];
  const stride = Math.max(1, Math.floor(Math.sqrt(mask.length / 40_000)));
  for (let row = 0; row < grid.height; row += stride) {
    for (let col = 0; col + 1 < grid.width; col += stride) {
      const i = row * grid.width + col;
      if (mask[i] && mask[i + 1] && z[i] === z[i] && z[i + 1] === z[i + 1]) steps.push(Math.abs(z[i + 1] - z[i]));
    }
  }
  if (steps.length === 0) return;
  steps.sort((a, b) => a - b);
  const median = steps[Math.floor(steps.length / 2)];
  if (median > bandWidthM / 2) {
    throw new GeodataError('dem_too_coarse',
      `The DEM is too coarse for ${bandWidthM} m bands: neighbouring cells (${grid.dx.toFixed(0)} m apart) differ by ${Math.round(median)} m in elevation (median), more than half a band. ` +
      `Use a finer DEM, or bands of at least ${Math.ceil((2 * median) / 50) * 50} m.`,
      'bandWidthM', { medianStepM: median });
  }
}
