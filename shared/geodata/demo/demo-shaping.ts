import type { DemoBandTarget } from './demo-valley';

/**
 * Gives the cells inside the catchment the elevations of the target hypsometry by rank: the
 * lowest shape value gets the lowest elevation, and within each band elevations spread evenly,
 * so the area per band equals the target's share. Cells outside keep the same monotone mapping,
 * continued at the end slopes.
 */
export function matchHypsometry(shape: Float32Array, inside: Uint8Array, targets: DemoBandTarget[]): Float32Array {
  const inner: number[] = [];
  for (let i = 0; i < shape.length; i++) if (inside[i]) inner.push(shape[i]);
  const sorted = Float64Array.from(inner).sort();
  const total = targets.reduce((s, b) => s + b.areaKm2, 0);
  const cumulative = [0];
  targets.forEach((b) => cumulative.push(cumulative[cumulative.length - 1] + b.areaKm2 / total));
  const elevationAt = (p: number) => {
    const k = Math.max(0, Math.min(targets.length - 1, cumulative.findIndex((c) => c > p) - 1));
    const span = cumulative[k + 1] - cumulative[k];
    const t = span > 0 ? (p - cumulative[k]) / span : 0;
    return targets[k].lowerM + Math.max(0, Math.min(0.9999, t)) * (targets[k].upperM - targets[k].lowerM);
  };
  const n = sorted.length;
  const lo = sorted[0];
  const hi = sorted[n - 1];
  const lowSlope = (elevationAt(0.02) - elevationAt(0)) / Math.max(1e-9, sorted[Math.floor(0.02 * n)] - lo);
  const highSlope = (elevationAt(0.9999) - elevationAt(0.98)) / Math.max(1e-9, hi - sorted[Math.floor(0.98 * n)]);
  const z = new Float32Array(shape.length);
  for (let i = 0; i < shape.length; i++) {
    const v = shape[i];
    if (v <= lo) z[i] = elevationAt(0) - (lo - v) * lowSlope;
    else if (v >= hi) z[i] = elevationAt(0.9999) + (v - hi) * highSlope * 0.5;
    else z[i] = elevationAt(rankOf(sorted, v) / (n - 1));
  }
  return z;
}

function rankOf(sorted: Float64Array, v: number): number {
  let lo = 0;
  let hi = sorted.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (sorted[mid] <= v) lo = mid; else hi = mid;
  }
  const span = sorted[hi] - sorted[lo];
  return lo + (span > 0 ? (v - sorted[lo]) / span : 0);
}

/** Marks the highest-scoring `share` of the cells that pass `eligible` (ties broken by index). */
export function pickShare(score: Float32Array, eligible: (i: number) => boolean, share: number, into: Uint8Array): void {
  const cells: number[] = [];
  for (let i = 0; i < score.length; i++) if (eligible(i)) cells.push(i);
  cells.sort((a, b) => score[b] - score[a] || a - b);
  const count = Math.round(share * cells.length);
  for (let k = 0; k < count; k++) into[cells[k]] = 1;
}
