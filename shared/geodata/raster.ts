import type { Crs } from './crs';

/**
 * A north-up grid: `x0, y0` is the outer top-left corner of the top-left cell, `dx, dy` (> 0) the
 * cell size in CRS units. Cell (row, col) has its centre at x0 + (col + ½)·dx, y0 − (row + ½)·dy,
 * GDAL's "pixel is area" convention. Cells are stored row by row from the top.
 */
export interface GridGeometry {
  width: number;
  height: number;
  x0: number;
  y0: number;
  dx: number;
  dy: number;
}

/** A single-band raster; `NaN` marks nodata (readers turn the file's nodata value into NaN). */
export interface Raster extends GridGeometry {
  values: Float32Array;
  crs: Crs;
}

export const cellCentreX = (g: GridGeometry, col: number): number => g.x0 + (col + 0.5) * g.dx;
export const cellCentreY = (g: GridGeometry, row: number): number => g.y0 - (row + 0.5) * g.dy;

/** Bounding box of the grid's outer edges: [minX, minY, maxX, maxY]. */
export function gridBounds(g: GridGeometry): [number, number, number, number] {
  return [g.x0, g.y0 - g.height * g.dy, g.x0 + g.width * g.dx, g.y0];
}

/**
 * Bilinear value at (x, y) between the four nearest cell centres, as GDAL's bilinear resampling
 * does; nodata neighbours are left out and the remaining weights renormalised. NaN outside the
 * grid's outer half-cell or where all four are nodata.
 */
export function sampleBilinear(r: Raster, x: number, y: number): number {
  const fx = (x - r.x0) / r.dx - 0.5;
  const fy = (r.y0 - y) / r.dy - 0.5;
  if (fx < -0.5 || fy < -0.5 || fx > r.width - 0.5 || fy > r.height - 0.5) return NaN;
  const c0 = Math.max(0, Math.min(r.width - 1, Math.floor(fx)));
  const r0 = Math.max(0, Math.min(r.height - 1, Math.floor(fy)));
  const c1 = Math.min(r.width - 1, c0 + 1);
  const r1 = Math.min(r.height - 1, r0 + 1);
  const tx = Math.max(0, Math.min(1, fx - c0));
  const ty = Math.max(0, Math.min(1, fy - r0));
  let sum = 0;
  let weight = 0;
  const add = (row: number, col: number, w: number) => {
    const v = r.values[row * r.width + col];
    if (w > 0 && v === v) { sum += v * w; weight += w; }
  };
  add(r0, c0, (1 - tx) * (1 - ty));
  add(r0, c1, tx * (1 - ty));
  add(r1, c0, (1 - tx) * ty);
  add(r1, c1, tx * ty);
  return weight > 0 ? sum / weight : NaN;
}

/** Value of the cell containing (x, y) (nearest neighbour, for class maps); NaN outside. */
export function sampleNearest(r: Raster, x: number, y: number): number {
  const col = Math.floor((x - r.x0) / r.dx);
  const row = Math.floor((r.y0 - y) / r.dy);
  if (col < 0 || row < 0 || col >= r.width || row >= r.height) return NaN;
  return r.values[row * r.width + col];
}

/** Share of cells that hold data (not NaN). */
export function validShare(values: Float32Array): number {
  let valid = 0;
  for (let i = 0; i < values.length; i++) if (values[i] === values[i]) valid++;
  return values.length ? valid / values.length : 0;
}
