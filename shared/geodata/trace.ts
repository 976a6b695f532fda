import { ringArea, type PolygonRings, type Ring } from './outline';
import type { GridGeometry } from './raster';

/**
 * Polygons along the cell edges of a mask (marked cells = 1), in the grid's system: outer rings
 * counter-clockwise, holes clockwise, collinear corners dropped. Cells touching only at a corner
 * become separate rings, so no ring crosses another (as `gdal_polygonize` with 4-connectedness).
 * Rasterising the result with the cell-centre rule gives the mask back.
 */
export function traceMask(mask: Uint8Array, grid: GridGeometry): PolygonRings[] {
  const { width: w, height: h } = grid;
  const inside = (r: number, c: number) => r >= 0 && c >= 0 && r < h && c < w && mask[r * w + c] === 1;
  // vertices are grid corners (c, r), 0 ≤ c ≤ w, 0 ≤ r ≤ h; key = r·(w + 1) + c
  const key = (c: number, r: number) => r * (w + 1) + c;
  const outgoing = new Map<number, number[]>();
  const add = (c0: number, r0: number, c1: number, r1: number) => {
    const k = key(c0, r0);
    const list = outgoing.get(k);
    const to = key(c1, r1);
    if (list) list.push(to); else outgoing.set(k, [to]);
  };
  for (let r = 0; r < h; r++) {
    for (let c = 0; c < w; c++) {
      if (!inside(r, c)) continue;
      // inside on the left when walking with y up (row index grows downward)
      if (!inside(r + 1, c)) add(c, r + 1, c + 1, r + 1);
      if (!inside(r, c + 1)) add(c + 1, r + 1, c + 1, r);
      if (!inside(r - 1, c)) add(c + 1, r, c, r);
      if (!inside(r, c - 1)) add(c, r, c, r + 1);
    }
  }
  const rings: Ring[] = [];
  for (const start of [...outgoing.keys()]) {
    while ((outgoing.get(start)?.length ?? 0) > 0) rings.push(walk(start, outgoing, w, grid));
  }
  const outers = rings.filter((r) => ringArea(r) > 0).map((r) => [r] as PolygonRings);
  for (const hole of rings.filter((r) => ringArea(r) < 0)) {
    const owner = outers.find((p) => containsPoint(p[0], hole[0][0] + 1e-9 * grid.dx, hole[0][1])) ?? outers.find((p) => containsPoint(p[0], hole[1][0], hole[1][1]));
    owner?.push(hole);
  }
  return outers;
}

function walk(start: number, outgoing: Map<number, number[]>, w: number, grid: GridGeometry): Ring {
  const at = (k: number) => [k % (w + 1), Math.floor(k / (w + 1))] as const;
  const vertices: number[] = [start];
  let previous = start;
  let current = popEdge(outgoing, start, null, at);
  while (current !== start) {
    vertices.push(current);
    const next = popEdge(outgoing, current, previous, at);
    previous = current;
    current = next;
  }
  const ring: Ring = [];
  const n = vertices.length;
  for (let i = 0; i < n; i++) {
    const [pc, pr] = at(vertices[(i + n - 1) % n]);
    const [c, r] = at(vertices[i]);
    const [nc, nr] = at(vertices[(i + 1) % n]);
    if ((c - pc) * (nr - r) - (r - pr) * (nc - c) === 0) continue; // straight on: not a corner
    ring.push([grid.x0 + c * grid.dx, grid.y0 - r * grid.dy]);
  }
  ring.push([ring[0][0], ring[0][1]]);
  return ring;
}

/** Takes the edge leaving `from`; where two leave (cells touching at a corner) the left turn, which keeps the ring around its own cell. */
function popEdge(outgoing: Map<number, number[]>, from: number, previous: number | null, at: (k: number) => readonly [number, number]): number {
  const list = outgoing.get(from) as number[];
  let pick = 0;
  if (list.length > 1 && previous !== null) {
    const [pc, pr] = at(previous);
    const [c, r] = at(from);
    // in (col, −row) coordinates a left turn has a positive cross product
    pick = list.findIndex((to) => {
      const [nc, nr] = at(to);
      return (c - pc) * (-(nr - r)) - (-(r - pr)) * (nc - c) > 0;
    });
    if (pick < 0) pick = 0;
  }
  const [to] = list.splice(pick, 1);
  return to;
}

function containsPoint(ring: Ring, x: number, y: number): boolean {
  let inside = false;
  for (let i = 0, j = ring.length - 2; i < ring.length - 1; j = i++) {
    const [xi, yi] = ring[i];
    const [xj, yj] = ring[j];
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}
