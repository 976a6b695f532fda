import type { PolygonRings } from './outline';

export interface Crossing { x: number; y: number; ringA: number; edgeA: number; ringB: number; edgeB: number }

/**
 * The first place where the edges of one polygon (its outer ring and holes) cross or overlap,
 * or null. Edges that only share an end point (neighbours in a ring, or rings touching at a
 * vertex, which the OGC simple-features rules allow) do not count. A sweep over edges sorted by
 * their left end keeps this near n log n for the long rings of glacier inventories.
 */
export function findSelfIntersection(polygon: PolygonRings): Crossing | null {
  const edges: { ring: number; edge: number; ax: number; ay: number; bx: number; by: number; minX: number; maxX: number }[] = [];
  polygon.forEach((ring, r) => {
    for (let i = 0; i + 1 < ring.length; i++) {
      const [ax, ay] = ring[i];
      const [bx, by] = ring[i + 1];
      if (ax === bx && ay === by) continue;
      edges.push({ ring: r, edge: i, ax, ay, bx, by, minX: Math.min(ax, bx), maxX: Math.max(ax, bx) });
    }
  });
  edges.sort((a, b) => a.minX - b.minX);
  const ringLengths = polygon.map((ring) => ring.length - 1);
  for (let i = 0; i < edges.length; i++) {
    const e = edges[i];
    for (let j = i + 1; j < edges.length && edges[j].minX <= e.maxX; j++) {
      const f = edges[j];
      if (e.ring === f.ring && areNeighbours(e.edge, f.edge, ringLengths[e.ring])) continue;
      const hit = crossingPoint(e, f);
      if (hit) {
        const [first, second] = e.ring < f.ring || (e.ring === f.ring && e.edge < f.edge) ? [e, f] : [f, e];
        return { x: hit[0], y: hit[1], ringA: first.ring, edgeA: first.edge, ringB: second.ring, edgeB: second.edge };
      }
    }
  }
  return null;
}

function areNeighbours(a: number, b: number, edgeCount: number): boolean {
  const d = Math.abs(a - b);
  return d === 1 || d === edgeCount - 1;
}

type Segment = { ax: number; ay: number; bx: number; by: number };

const orient = (ax: number, ay: number, bx: number, by: number, cx: number, cy: number) => (bx - ax) * (cy - ay) - (by - ay) * (cx - ax);

/** Where two segments cross in their interiors or overlap along a stretch; null for no contact or a shared end point only. */
function crossingPoint(s: Segment, t: Segment): [number, number] | null {
  const d1 = orient(s.ax, s.ay, s.bx, s.by, t.ax, t.ay);
  const d2 = orient(s.ax, s.ay, s.bx, s.by, t.bx, t.by);
  const d3 = orient(t.ax, t.ay, t.bx, t.by, s.ax, s.ay);
  const d4 = orient(t.ax, t.ay, t.bx, t.by, s.bx, s.by);
  if (((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0))) {
    const u = d1 / (d1 - d2);
    return [t.ax + u * (t.bx - t.ax), t.ay + u * (t.by - t.ay)];
  }
  if (d1 === 0 && d2 === 0) return collinearOverlap(s, t);
  // An end point lying inside the other segment (a T-touch) also breaks a simple ring.
  for (const [px, py, o, seg] of [[t.ax, t.ay, d1, s], [t.bx, t.by, d2, s], [s.ax, s.ay, d3, t], [s.bx, s.by, d4, t]] as const) {
    if (o === 0 && strictlyInside(seg, px, py)) return [px, py];
  }
  return null;
}

function strictlyInside(s: Segment, px: number, py: number): boolean {
  const inX = Math.min(s.ax, s.bx) <= px && px <= Math.max(s.ax, s.bx);
  const inY = Math.min(s.ay, s.by) <= py && py <= Math.max(s.ay, s.by);
  const atEnd = (px === s.ax && py === s.ay) || (px === s.bx && py === s.by);
  return inX && inY && !atEnd;
}

function collinearOverlap(s: Segment, t: Segment): [number, number] | null {
  const useX = Math.abs(s.bx - s.ax) >= Math.abs(s.by - s.ay);
  const key = (x: number, y: number) => (useX ? x : y);
  const [s0, s1] = [key(s.ax, s.ay), key(s.bx, s.by)].sort((a, b) => a - b);
  const [t0, t1] = [key(t.ax, t.ay), key(t.bx, t.by)].sort((a, b) => a - b);
  const lo = Math.max(s0, t0);
  const hi = Math.min(s1, t1);
  if (hi <= lo) return null;
  const mid = (lo + hi) / 2;
  const u = (mid - key(s.ax, s.ay)) / (key(s.bx, s.by) - key(s.ax, s.ay));
  return [s.ax + u * (s.bx - s.ax), s.ay + u * (s.by - s.ay)];
}
