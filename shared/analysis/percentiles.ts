/**
 * Percentile of a sample by linear interpolation between order statistics (Hyndman & Fan 1996,
 * Am. Stat. 50:361, definition 7 — the default of R and NumPy).
 * @param p percentile 0 … 100
 * @example percentile([1, 2, 3, 4], 50) // 2.5
 */
export function percentile(values: readonly number[], p: number): number {
  return percentileOfSorted([...values].sort((a, b) => a - b), p);
}

export function percentileOfSorted(sorted: readonly number[], p: number): number {
  if (sorted.length === 0) throw new RangeError('percentile: the sample is empty');
  if (!(p >= 0 && p <= 100)) throw new RangeError(`percentile: p must be between 0 and 100 (got ${p})`);
  const h = (sorted.length - 1) * (p / 100);
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, sorted.length - 1);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}

export interface Band5to95 {
  p5: number;
  p50: number;
  p95: number;
}

/** 5th, 50th and 95th percentiles of a sample. */
export function band5to95(values: readonly number[]): Band5to95 {
  const sorted = [...values].sort((a, b) => a - b);
  return { p5: percentileOfSorted(sorted, 5), p50: percentileOfSorted(sorted, 50), p95: percentileOfSorted(sorted, 95) };
}

/**
 * Per time step 5/50/95 % percentiles of an ensemble of equally long series (members × steps).
 */
export function seriesBand5to95(members: readonly (readonly number[])[]): { p5: number[]; p50: number[]; p95: number[] } {
  if (members.length === 0) throw new RangeError('seriesBand5to95: the ensemble is empty');
  const steps = members[0].length;
  const out = { p5: new Array<number>(steps), p50: new Array<number>(steps), p95: new Array<number>(steps) };
  const column = new Array<number>(members.length);
  for (let t = 0; t < steps; t++) {
    for (let m = 0; m < members.length; m++) column[m] = members[m][t];
    const band = band5to95(column);
    out.p5[t] = band.p5;
    out.p50[t] = band.p50;
    out.p95[t] = band.p95;
  }
  return out;
}
