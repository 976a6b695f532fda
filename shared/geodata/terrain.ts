import type { GridGeometry } from './raster';

/** Per-cell surface gradient of a metric DEM: dz/dx eastward and dz/dy northward (m per m). */
export interface Gradient {
  east: Float32Array;
  north: Float32Array;
}

const RAD = 180 / Math.PI;

/**
 * Horn's (1981) third-order finite difference over the 3 × 3 window
 *   a b c
 *   d e f     dz/dx = ((c + 2f + i) − (a + 2d + g)) / 8Δx,  dz/dy = ((a + 2b + c) − (g + 2h + i)) / 8Δy
 *   g h i
 * the method `gdaldem slope/aspect` uses by default (Horn 1981, Proc. IEEE 69:14). Neighbours
 * beyond the grid are extrapolated and nodata neighbours take the centre's value (`edgeWindow`),
 * so edge cells get a slope as with `gdaldem -compute_edges`; a nodata centre gives NaN. Δx, Δy are the grid's cell sizes, so the grid must be in metres.
 */
export function hornGradient(z: Float32Array, grid: GridGeometry): Gradient {
  const { width: w, height: h } = grid;
  const east = new Float32Array(w * h);
  const north = new Float32Array(w * h);
  const ex = 1 / (8 * grid.dx);
  const ny = 1 / (8 * grid.dy);
  for (let row = 0; row < h; row++) {
    const up = row - 1;
    const down = row + 1;
    const interiorRow = row > 0 && row < h - 1;
    for (let col = 0; col < w; col++) {
      const i0 = row * w + col;
      const e = z[i0];
      if (e !== e) { east[i0] = NaN; north[i0] = NaN; continue; }
      const left = col - 1;
      const right = col + 1;
      let a: number, b: number, c: number, d: number, f: number, g: number, hh: number, i: number;
      if (interiorRow && left >= 0 && right < w) {
        a = z[up * w + left]; b = z[up * w + col]; c = z[up * w + right];
        d = z[row * w + left]; f = z[row * w + right];
        g = z[down * w + left]; hh = z[down * w + col]; i = z[down * w + right];
        // nodata neighbours fall back to the centre (NaN !== NaN)
        if (a !== a) a = e; if (b !== b) b = e; if (c !== c) c = e; if (d !== d) d = e;
        if (f !== f) f = e; if (g !== g) g = e; if (hh !== hh) hh = e; if (i !== i) i = e;
      } else {
        const v = edgeWindow(z, w, h, row, col, e);
        a = v(row - 1, col - 1); b = v(row - 1, col); c = v(row - 1, col + 1);
        d = v(row, col - 1); f = v(row, col + 1);
        g = v(row + 1, col - 1); hh = v(row + 1, col); i = v(row + 1, col + 1);
      }
      east[i0] = (c + 2 * f + i - (a + 2 * d + g)) * ex;
      north[i0] = (a + 2 * b + c - (g + 2 * hh + i)) * ny;
    }
  }
  return { east, north };
}

/**
 * Neighbours of an edge cell: those beyond the grid are extrapolated linearly from the two cells
 * inside along the same column (or row), as `gdaldem -compute_edges` does on edges (exact on a
 * plane, at corners too); nodata neighbours take the centre's value.
 */
function edgeWindow(z: Float32Array, w: number, h: number, row: number, col: number, centre: number): (rr: number, cc: number) => number {
  const get = (rr: number, cc: number) => {
    const x = z[rr * w + cc];
    return x === x ? x : centre;
  };
  const inRow = (rr: number, cc: number) => {
    if (cc >= 0 && cc < w) return get(rr, cc);
    const beyond = cc < 0 ? col + 1 : col - 1;
    return beyond >= 0 && beyond < w ? 2 * get(rr, col) - get(rr, beyond) : get(rr, col);
  };
  return (rr, cc) => {
    if (rr >= 0 && rr < h) return inRow(rr, cc);
    const beyond = rr < 0 ? row + 1 : row - 1;
    return beyond >= 0 && beyond < h ? 2 * inRow(row, cc) - inRow(beyond, cc) : inRow(row, cc);
  };
}

/** Slope angle in degrees from the gradient: atan √(gx² + gy²) (as gdaldem slope). */
export function slopeDeg(gx: number, gy: number): number {
  return Math.atan(Math.sqrt(gx * gx + gy * gy)) * RAD;
}

/**
 * Aspect: the compass direction the slope faces (downhill), degrees clockwise from north in
 * [0, 360), as gdaldem aspect; NaN on flat cells (gdaldem writes nodata there).
 */
export function aspectDeg(gx: number, gy: number): number {
  if (gx === 0 && gy === 0) return NaN;
  const a = Math.atan2(-gx, -gy) * RAD;
  return a < 0 ? a + 360 : a;
}

/**
 * Shaded relief as `gdaldem hillshade` writes it (byte values 1–255, 0 for nodata): 1 + 254 ×
 * the cosine of the sun's incidence on the cell's plane, 1 where the cell faces away. Sun from
 * azimuth 315° (north-west) and 45° above the horizon by default, the cartographic convention.
 */
export function hillshade(gradient: Gradient, azimuthDeg = 315, altitudeDeg = 45): Uint8Array {
  const { east, north } = gradient;
  const out = new Uint8Array(east.length);
  const az = azimuthDeg / RAD;
  const alt = altitudeDeg / RAD;
  const sx = Math.sin(az) * Math.cos(alt);
  const sy = Math.cos(az) * Math.cos(alt);
  const sz = Math.sin(alt);
  for (let k = 0; k < out.length; k++) {
    const gx = east[k];
    const gy = north[k];
    if (gx !== gx) continue;
    const cosIncidence = (sz - gx * sx - gy * sy) / Math.sqrt(1 + gx * gx + gy * gy);
    out[k] = cosIncidence <= 0 ? 1 : Math.round(1 + 254 * cosIncidence);
  }
  return out;
}
