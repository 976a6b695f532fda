import type { GridGeometry } from './raster';
import { aspectDeg, type Gradient } from './terrain';

export const ASPECT_CLASSES = ['N', 'E', 'S', 'W'] as const;
export type AspectClass = (typeof ASPECT_CLASSES)[number];

/** Aspect class of a cell: north 315–45°, east 45–135°, south 135–225°, west 225–315°; flat cells count as north. */
export function aspectClassIndex(aspect: number): number {
  if (aspect !== aspect) return 0;
  return Math.floor(((aspect + 45) % 360) / 90);
}

/**
 * Band edges from the lowest to the highest cell on multiples of the band width
 * (e.g. 2600, 2800, …), with bands that hold no cell (below a cliff, say) merged into the band
 * above so the table stays contiguous. Returns the edges and the band of every cell (−1 outside).
 */
export function assignBands(z: Float32Array, mask: Uint8Array, bandWidthM: number): { edges: number[]; band: Int16Array } {
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < z.length; i++) {
    if (mask[i] && z[i] === z[i]) { if (z[i] < min) min = z[i]; if (z[i] > max) max = z[i]; }
  }
  const lowest = Math.floor(min / bandWidthM) * bandWidthM;
  const bins = Math.max(1, Math.ceil((max - lowest) / bandWidthM));
  const binOf = (v: number) => Math.min(bins - 1, Math.floor((v - lowest) / bandWidthM));
  const counts = new Int32Array(bins);
  for (let i = 0; i < z.length; i++) if (mask[i] && z[i] === z[i]) counts[binOf(z[i])]++;
  const binToBand = new Int16Array(bins);
  const edges = [lowest];
  let band = 0;
  for (let b = 0; b < bins; b++) {
    binToBand[b] = band;
    if (counts[b] > 0 || b === bins - 1) {
      edges.push(lowest + (b + 1) * bandWidthM);
      band++;
    }
  }
  // empty bins were given the index of the band they join (the next non-empty one)
  const bandOf = new Int16Array(z.length).fill(-1);
  for (let i = 0; i < z.length; i++) if (mask[i] && z[i] === z[i]) bandOf[i] = binToBand[binOf(z[i])];
  return { edges, band: bandOf };
}

/** Everything summed per response unit in one pass over the cells. */
export interface UnitSums {
  cells: Float64Array;
  areaM2: Float64Array;
  trueAreaM2: Float64Array;
  slopeDegArea: Float64Array;
  aspectSin: Float64Array;
  aspectCos: Float64Array;
  aspectWeight: Float64Array;
  elevationArea: Float64Array;
  minM: Float64Array;
  maxM: Float64Array;
  glacierM2: Float64Array;
  debrisM2: Float64Array;
  thicknessArea: Float64Array;
  thicknessM2: Float64Array;
}

export interface UnitInputs {
  z: Float32Array;
  grid: GridGeometry;
  gradient: Gradient;
  unit: Int32Array;
  unitCount: number;
  glacier: Uint8Array | null;
  debris: Uint8Array | null;
  thickness: Float32Array | null;
  /** Planimetric area of a cell in each column (m²): the grid cell corrected by the projection's scale. */
  cellAreaByColumn: Float64Array;
}

/**
 * Sums per unit: planimetric area (cells × cell area), true surface area (cell area / cos S,
 * the common approximation of Jenness's (2004) surface area for smooth terrain), slope (mean of
 * cell slopes, area-weighted, as zonal statistics of `gdaldem slope` give), aspect as unit vectors
 * for the circular mean (flat cells left out), glacier and debris-on-glacier areas, and debris
 * thickness over debris-covered glacier cells where the thickness raster has data.
 */
export function sumUnits(input: UnitInputs): UnitSums {
  const n = input.unitCount;
  const make = () => new Float64Array(n);
  const s: UnitSums = {
    cells: make(), areaM2: make(), trueAreaM2: make(), slopeDegArea: make(), aspectSin: make(), aspectCos: make(),
    aspectWeight: make(), elevationArea: make(), minM: make().fill(Infinity), maxM: make().fill(-Infinity),
    glacierM2: make(), debrisM2: make(), thicknessArea: make(), thicknessM2: make(),
  };
  const { z, grid, gradient, unit, glacier, debris, thickness, cellAreaByColumn } = input;
  const rad = Math.PI / 180;
  for (let i = 0; i < z.length; i++) {
    const u = unit[i];
    if (u < 0) continue;
    const a = cellAreaByColumn[i % grid.width];
    const gx = gradient.east[i];
    const gy = gradient.north[i];
    const g2 = gx * gx + gy * gy;
    s.cells[u]++;
    s.areaM2[u] += a;
    s.trueAreaM2[u] += a * Math.sqrt(1 + g2);
    s.slopeDegArea[u] += a * Math.atan(Math.sqrt(g2)) / rad;
    const aspect = aspectDeg(gx, gy);
    if (aspect === aspect) {
      s.aspectSin[u] += a * Math.sin(aspect * rad);
      s.aspectCos[u] += a * Math.cos(aspect * rad);
      s.aspectWeight[u] += a;
    }
    const zi = z[i];
    s.elevationArea[u] += a * zi;
    if (zi < s.minM[u]) s.minM[u] = zi;
    if (zi > s.maxM[u]) s.maxM[u] = zi;
    if (glacier && glacier[i]) {
      s.glacierM2[u] += a;
      if (debris && debris[i]) {
        s.debrisM2[u] += a;
        const h = thickness ? thickness[i] : NaN;
        if (h === h) { s.thicknessArea[u] += a * h; s.thicknessM2[u] += a; }
      }
    }
  }
  return s;
}

/** Circular mean aspect (degrees from north, 0–360) and the mean resultant length (0 = no common direction, 1 = all alike). */
export function circularMeanAspect(sin: number, cos: number, weight: number): { aspectDeg: number; consistency: number } {
  if (weight <= 0) return { aspectDeg: 0, consistency: 0 };
  let a = (Math.atan2(sin, cos) * 180) / Math.PI;
  if (a < 0) a += 360;
  return { aspectDeg: a, consistency: Math.hypot(sin, cos) / weight };
}
