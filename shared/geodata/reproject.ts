import proj4 from 'proj4';
import type { Crs } from './crs';
import { cellCentreX, cellCentreY, gridBounds, sampleBilinear, sampleNearest, type GridGeometry, type Raster } from './raster';

export type PointTransform = (x: number, y: number) => [number, number];

/** proj4's transform from one system to another (identity when both are the same definition). */
export function pointTransform(from: Crs, to: Crs): PointTransform {
  if (from.proj4 === to.proj4) return (x, y) => [x, y];
  const converter = proj4(from.proj4, to.proj4);
  return (x, y) => {
    const [tx, ty] = converter.forward([x, y]);
    return [tx, ty];
  };
}

/** Lattice spacing (cells) for the approximate transform; the error check below halves it when needed. */
const LATTICE_STEP = 16;

/**
 * Source-system coordinates of every cell centre of `target`, one row at a time. Like GDAL's
 * approximate transformer (gdalwarp -et), proj4 runs exactly on a lattice every few cells and the
 * rows between are interpolated; the lattice is made finer until the mid-point error is below
 * `toleranceSource` source units.
 */
export function gridCoordinateRows(target: GridGeometry, transform: PointTransform, toleranceSource: number): (row: number, outX: Float64Array, outY: Float64Array) => void {
  let step = LATTICE_STEP;
  for (;;) {
    const lattice = buildLattice(target, transform, step);
    if (step === 1 || latticeError(target, transform, lattice, step) <= toleranceSource) {
      return (row, outX, outY) => interpolateRow(target, lattice, step, row, outX, outY);
    }
    step = Math.max(1, step >> 1);
  }
}

interface Lattice { cols: number; rows: number; xs: Float64Array; ys: Float64Array }

function buildLattice(g: GridGeometry, transform: PointTransform, step: number): Lattice {
  const cols = Math.ceil((g.width - 1) / step) + 1;
  const rows = Math.ceil((g.height - 1) / step) + 1;
  const xs = new Float64Array(cols * rows);
  const ys = new Float64Array(cols * rows);
  for (let j = 0; j < rows; j++) {
    for (let i = 0; i < cols; i++) {
      const [x, y] = transform(cellCentreX(g, Math.min(i * step, g.width - 1)), cellCentreY(g, Math.min(j * step, g.height - 1)));
      xs[j * cols + i] = x;
      ys[j * cols + i] = y;
    }
  }
  return { cols, rows, xs, ys };
}

function interpolateAt(g: GridGeometry, l: Lattice, step: number, row: number, col: number): [number, number] {
  const j = Math.min(l.rows - 2, Math.floor(row / step));
  const i = Math.min(l.cols - 2, Math.floor(col / step));
  const rowSpan = Math.max(1, Math.min(g.height - 1, (j + 1) * step) - j * step);
  const colSpan = Math.max(1, Math.min(g.width - 1, (i + 1) * step) - i * step);
  const ty = l.rows > 1 ? (row - j * step) / rowSpan : 0;
  const tx = l.cols > 1 ? (col - i * step) / colSpan : 0;
  const at = (jj: number, ii: number) => Math.min(jj, l.rows - 1) * l.cols + Math.min(ii, l.cols - 1);
  const a = at(j, i), b = at(j, i + 1), c = at(j + 1, i), d = at(j + 1, i + 1);
  const x = (1 - ty) * ((1 - tx) * l.xs[a] + tx * l.xs[b]) + ty * ((1 - tx) * l.xs[c] + tx * l.xs[d]);
  const y = (1 - ty) * ((1 - tx) * l.ys[a] + tx * l.ys[b]) + ty * ((1 - tx) * l.ys[c] + tx * l.ys[d]);
  return [x, y];
}

function latticeError(g: GridGeometry, transform: PointTransform, l: Lattice, step: number): number {
  let worst = 0;
  const probes = Math.min(64, l.cols * l.rows);
  for (let k = 0; k < probes; k++) {
    const row = Math.min(g.height - 1, Math.floor(((k * 7919) % l.rows) * step + step / 2));
    const col = Math.min(g.width - 1, Math.floor(((k * 104729) % l.cols) * step + step / 2));
    const [ex, ey] = transform(cellCentreX(g, col), cellCentreY(g, row));
    const [ax, ay] = interpolateAt(g, l, step, row, col);
    worst = Math.max(worst, Math.hypot(ex - ax, ey - ay));
  }
  return worst;
}

function interpolateRow(g: GridGeometry, l: Lattice, step: number, row: number, outX: Float64Array, outY: Float64Array): void {
  for (let col = 0; col < g.width; col++) {
    const [x, y] = interpolateAt(g, l, step, row, col);
    outX[col] = x;
    outY[col] = y;
  }
}

/**
 * Resamples `source` onto `target` (grid and system) like `gdalwarp -r bilinear` (or `-r near` for
 * class maps). Cells whose centre falls outside the source, or on nodata, become NaN.
 */
export function warpRaster(source: Raster, target: GridGeometry, targetCrs: Crs, method: 'bilinear' | 'nearest' = 'bilinear'): Raster {
  const values = new Float32Array(target.width * target.height);
  const rowCoordinates = gridCoordinateRows(target, pointTransform(targetCrs, source.crs), Math.min(source.dx, source.dy) / 8);
  const xs = new Float64Array(target.width);
  const ys = new Float64Array(target.width);
  const sample = method === 'bilinear' ? sampleBilinear : sampleNearest;
  for (let row = 0; row < target.height; row++) {
    rowCoordinates(row, xs, ys);
    for (let col = 0; col < target.width; col++) values[row * target.width + col] = sample(source, xs[col], ys[col]);
  }
  return { ...target, values, crs: targetCrs };
}

/**
 * A grid in `targetCrs` covering `source`'s extent with square cells of `cellSize` target units,
 * its corners on multiples of the cell size (as gdalwarp -tap).
 */
export function coveringGrid(source: GridGeometry, sourceCrs: Crs, targetCrs: Crs, cellSize: number): GridGeometry {
  const transform = pointTransform(sourceCrs, targetCrs);
  const [minX, minY, maxX, maxY] = gridBounds(source);
  let tMinX = Infinity, tMinY = Infinity, tMaxX = -Infinity, tMaxY = -Infinity;
  const n = 32;
  for (let k = 0; k <= n; k++) {
    const f = k / n;
    for (const [x, y] of [[minX + f * (maxX - minX), minY], [minX + f * (maxX - minX), maxY], [minX, minY + f * (maxY - minY)], [maxX, minY + f * (maxY - minY)]]) {
      const [tx, ty] = transform(x, y);
      tMinX = Math.min(tMinX, tx); tMaxX = Math.max(tMaxX, tx);
      tMinY = Math.min(tMinY, ty); tMaxY = Math.max(tMaxY, ty);
    }
  }
  const x0 = Math.floor(tMinX / cellSize) * cellSize;
  const y0 = Math.ceil(tMaxY / cellSize) * cellSize;
  return {
    x0, y0, dx: cellSize, dy: cellSize,
    width: Math.ceil((tMaxX - x0) / cellSize),
    height: Math.ceil((y0 - tMinY) / cellSize),
  };
}
