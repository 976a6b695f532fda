import { crsFromEpsg } from './crs';
import { GeodataError } from './errors';
import type { Outline } from './outline';
import type { Raster } from './raster';

/** Shared fixtures for the geodata unit tests: a cone-shaped mountain on a 30 m UTM grid, box outlines, refusals. */
export const UTM44N = crsFromEpsg(32644, 'dem');
export const ORIGIN = { x0: 560_010, y0: 3_760_020 };

/** A cone from `base` m at its foot to `top` m at the centre, `n` × `n` cells of `cell` m. */
export function coneDem(n = 200, cell = 30, base = 3000, top = 5000): Raster {
  const values = new Float32Array(n * n);
  const radius = (n * cell) / 2;
  for (let r = 0; r < n; r++) {
    for (let c = 0; c < n; c++) {
      const d = Math.hypot((c + 0.5) * cell - radius, (r + 0.5) * cell - radius);
      values[r * n + c] = Math.max(base, top - ((top - base) * d) / radius);
    }
  }
  return { width: n, height: n, ...ORIGIN, dx: cell, dy: cell, values, crs: UTM44N };
}

/** An axis-aligned rectangle (UTM metres from the grid's corner) as an outline. */
export function boxOutline(fromX: number, fromY: number, toX: number, toY: number, dem: Raster = coneDem()): Outline {
  const x0 = dem.x0;
  const y0 = dem.y0;
  return {
    crs: dem.crs,
    polygons: [[[[x0 + fromX, y0 - toY], [x0 + toX, y0 - toY], [x0 + toX, y0 - fromY], [x0 + fromX, y0 - fromY], [x0 + fromX, y0 - toY]]]],
  };
}

/** Runs `run` and returns the GeodataError it throws; fails the test when it throws nothing or something else. */
export function refusal(run: () => unknown): GeodataError {
  try {
    run();
  } catch (error) {
    if (error instanceof GeodataError) return error;
    throw error;
  }
  throw new Error('expected a refusal');
}
