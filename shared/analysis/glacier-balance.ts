import type { SimulationResult } from '../melt/result';

/**
 * The glacier's mass balance from one engine run, with the band's snow taken as lying evenly over
 * the band (the engine keeps one snowpack per band): on the glacier part of band b,
 *   B_b = (SWE_end − SWE_start) − (ice melt + melt under debris + vapour loss from ice) / g_b,
 * mm w.e. over the glacier part (g_b its share of the band); NaN for a band without glacier.
 * The glacier-wide balance is their mean weighted by glacier area (common practice for
 * glacier-wide balances from elevation bands).
 */
export function bandGlacierBalanceMm(result: SimulationResult, glacierFraction: ArrayLike<number>): number[] {
  const t = result.bandTotals;
  return Array.from({ length: result.bandCount }, (_, b) => {
    const g = glacierFraction[b];
    if (!(g > 0)) return Number.NaN;
    return t.sweEndMm[b] - t.sweStartMm[b] - (t.iceMeltMm[b] + t.debrisIceMeltMm[b] + t.iceVapourLossMm[b]) / g;
  });
}

/** Glacier-wide balance, mm w.e. over the glacier area; null without glacier. */
export function glacierWideBalanceMm(result: SimulationResult, glacierFraction: ArrayLike<number>, bandBalanceMm = bandGlacierBalanceMm(result, glacierFraction)): number | null {
  let area = 0;
  let sum = 0;
  for (let b = 0; b < result.bandCount; b++) {
    const a = glacierFraction[b] * result.bands.areaM2[b];
    if (!(a > 0)) continue;
    area += a;
    sum += a * bandBalanceMm[b];
  }
  return area > 0 ? sum / area : null;
}
