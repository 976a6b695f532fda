import type { PolygonRings } from './outline';
import { cellCentreY, type GridGeometry } from './raster';

/**
 * Marks the cells whose centre lies inside any of the polygons (holes excluded), the rule
 * `gdal_rasterize` uses without ALL_TOUCHED. Polygons must be in the grid's system. Each row's
 * centre line is cut by the polygon's edges and the cells between pairs of crossings are filled
 * (even–odd, so holes fall out); an edge counts when the line passes in [min y, max y).
 */
export function rasterizePolygons(polygons: PolygonRings[], grid: GridGeometry, into = new Uint8Array(grid.width * grid.height)): Uint8Array {
  const crossings: number[] = [];
  for (const polygon of polygons) {
    let minY = Infinity, maxY = -Infinity;
    for (const [, y] of polygon[0]) { minY = Math.min(minY, y); maxY = Math.max(maxY, y); }
    const firstRow = Math.max(0, Math.floor((grid.y0 - maxY) / grid.dy - 0.5));
    const lastRow = Math.min(grid.height - 1, Math.ceil((grid.y0 - minY) / grid.dy - 0.5));
    for (let row = firstRow; row <= lastRow; row++) {
      const y = cellCentreY(grid, row);
      crossings.length = 0;
      for (const ring of polygon) {
        for (let i = 0; i + 1 < ring.length; i++) {
          const [ax, ay] = ring[i];
          const [bx, by] = ring[i + 1];
          if ((ay <= y && by > y) || (by <= y && ay > y)) crossings.push(ax + ((y - ay) / (by - ay)) * (bx - ax));
        }
      }
      crossings.sort((a, b) => a - b);
      for (let k = 0; k + 1 < crossings.length; k += 2) {
        const from = Math.max(0, Math.ceil((crossings[k] - grid.x0) / grid.dx - 0.5));
        const to = Math.min(grid.width - 1, Math.ceil((crossings[k + 1] - grid.x0) / grid.dx - 0.5) - 1);
        for (let col = from; col <= to; col++) into[row * grid.width + col] = 1;
      }
    }
  }
  return into;
}

/** Number of marked cells. */
export function countMarked(mask: Uint8Array): number {
  let n = 0;
  for (let i = 0; i < mask.length; i++) n += mask[i];
  return n;
}

