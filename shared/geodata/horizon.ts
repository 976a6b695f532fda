import type { GridGeometry } from './raster';

/** Mean Earth radius (m) and the curvature-and-refraction coefficient GDAL's viewshed uses by default (1 − 1/7; common practice). */
const EARTH_RADIUS_M = 6_371_000;
export const CURVATURE_REFRACTION = 0.85714;

/** Buffers reused from one azimuth to the next, so a sweep allocates once per grid. */
export interface HorizonWork {
  position: Float64Array;
  lifted: Float64Array;
  cell: Int32Array;
  next: Int32Array;
  slopes: Float64Array;
  /** The same profile walked the other way. */
  positionBack: Float64Array;
  liftedBack: Float64Array;
}

export function horizonWork(grid: GridGeometry): HorizonWork {
  const n = Math.max(grid.width, grid.height) + 2;
  return { position: new Float64Array(n), lifted: new Float64Array(n), cell: new Int32Array(n), next: new Int32Array(n), slopes: new Float64Array(n), positionBack: new Float64Array(n), liftedBack: new Float64Array(n) };
}

/**
 * Tangent of the horizon's elevation angle, looking from every cell towards `azimuthDeg`
 * (clockwise from north), written into `out` (one value per cell; −Infinity where no terrain
 * lies ahead inside the grid, NaN where the cell has no data).
 *
 * Dozier & Frew (1990, IEEE Trans. Geosci. Remote Sens. 28:963) along straight profiles: the grid
 * is cut into parallel lines in that direction, one sample per cell of the dominant axis (the
 * other coordinate interpolated linearly between the two nearest cells, so each cell gets the
 * sample less than half a cell from its centre). Walking each line backwards, the horizon of
 * point i is found on the chain of horizons of i + 1 (the upper convex hull ahead of it), which
 * makes a profile of n points cost about n steps instead of n². Earth curvature and refraction
 * lower distant terrain by c·d²/2R (c = 0.85714, as gdal_viewshed); writing z′ = z − c·x²/2R in
 * line coordinates keeps the hull search exact and adds c·xᵢ/R to the tangent.
 *
 * With `opposite`, the horizons towards azimuth + 180° are written there from the same profiles
 * walked the other way, which saves sampling the grid twice.
 */
export function horizonTangents(z: Float32Array, grid: GridGeometry, azimuthDeg: number, out: Float32Array, work = horizonWork(grid), curvature = true, opposite?: Float32Array): void {
  const { width: w, height: h } = grid;
  const phi = (azimuthDeg * Math.PI) / 180;
  const east = Math.sin(phi);
  const northward = Math.cos(phi);
  const alongColumns = Math.abs(east) / grid.dx >= Math.abs(northward) / grid.dy;
  // major axis: the one advanced by exactly one cell per step
  const majorCount = alongColumns ? w : h;
  const minorCount = alongColumns ? h : w;
  const majorStride = alongColumns ? 1 : w;
  const minorStride = alongColumns ? w : 1;
  const dir = alongColumns ? Math.sign(east) : -Math.sign(northward);
  const stepM = alongColumns ? grid.dx / Math.abs(east) : grid.dy / Math.abs(northward);
  // minor-index change per step (row index grows southward)
  const slope = alongColumns ? (-northward * grid.dx) / (grid.dy * Math.abs(east)) : (east * grid.dy) / (grid.dx * Math.abs(northward));
  const kappa = curvature ? CURVATURE_REFRACTION / (2 * EARTH_RADIUS_M) : 0;
  const { position, lifted, cell, next, slopes } = work;
  out.fill(NaN);
  opposite?.fill(NaN);
  const { positionBack, liftedBack } = work;

  const span = slope * (majorCount - 1);
  const firstOffset = Math.ceil(-0.5 - Math.max(0, span)) - 1;
  const lastOffset = Math.floor(minorCount - 0.5 - Math.min(0, span)) + 1;
  for (let offset = firstOffset; offset <= lastOffset; offset++) {
    let n = 0;
    // the steps whose minor coordinate lies on the grid, −0.5 ≤ q < minorCount − 0.5
    let first = 0;
    let last = majorCount - 1;
    if (slope !== 0) {
      const a = (-0.5 - offset) / slope;
      const b = (minorCount - 0.5 - offset) / slope;
      first = Math.max(0, Math.floor(Math.min(a, b)));
      last = Math.min(majorCount - 1, Math.ceil(Math.max(a, b)));
    }
    for (let s = first; s <= last; s++) {
      const q = offset + slope * s;
      if (q < -0.5 || q >= minorCount - 0.5) continue;
      const major = dir > 0 ? s : majorCount - 1 - s;
      const lo = Math.floor(q);
      const t = q - lo;
      const loIndex = Math.max(0, lo);
      const hiIndex = Math.min(minorCount - 1, lo + 1);
      const zLo = z[major * majorStride + loIndex * minorStride];
      const zHi = z[major * majorStride + hiIndex * minorStride];
      const zq = t === 0 ? zLo : zLo + t * (zHi - zLo);
      if (zq !== zq) continue;
      const x = s * stepM;
      position[n] = x;
      lifted[n] = zq - kappa * x * x;
      cell[n] = major * majorStride + Math.round(q) * minorStride;
      n++;
    }
    if (n === 0) continue;
    profileHorizons(position, lifted, n, next, slopes);
    for (let i = 0; i < n; i++) {
      const target = cell[i];
      if (z[target] === z[target]) out[target] = i === n - 1 ? -Infinity : slopes[i] + 2 * kappa * position[i];
    }
    if (!opposite) continue;
    // walking back: x′ = −x keeps positions increasing, and z − κx² is the same for ±x
    for (let i = 0; i < n; i++) {
      positionBack[i] = -position[n - 1 - i];
      liftedBack[i] = lifted[n - 1 - i];
    }
    profileHorizons(positionBack, liftedBack, n, next, slopes);
    for (let i = 0; i < n; i++) {
      const target = cell[n - 1 - i];
      if (z[target] === z[target]) opposite[target] = i === n - 1 ? -Infinity : slopes[i] + 2 * kappa * positionBack[i];
    }
  }
}


/**
 * Horizons along one profile of n points (positions increasing): for every point but the last,
 * the steepest slope (z_j − z_i)/(x_j − x_i) to any point ahead, in `slopes`, and that point's
 * index in `next`. Walking backwards, point i's horizon lies on the chain i + 1, next[i + 1], …
 * (the upper convex hull of the points ahead), where the slope from i rises to its maximum and
 * then falls (Dozier & Frew 1990), so the walk stops at the first fall.
 */
export function profileHorizons(position: Float64Array, height: Float64Array, n: number, next: Int32Array, slopes: Float64Array): void {
  next[n - 1] = -1;
  slopes[n - 1] = -Infinity;
  for (let i = n - 2; i >= 0; i--) {
    const xi = position[i];
    const zi = height[i];
    let j = i + 1;
    let best = (height[j] - zi) / (position[j] - xi);
    for (let k = next[j]; k >= 0; k = next[k]) {
      const candidate = (height[k] - zi) / (position[k] - xi);
      if (candidate < best) break;
      best = candidate;
      j = k;
    }
    next[i] = j;
    slopes[i] = best;
  }
}
