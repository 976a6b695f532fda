/**
 * Fixed-bin histograms for many groups at once (e.g. horizon angles per band and sector), and
 * percentiles read from them with linear interpolation inside the bin, so percentiles over
 * millions of cells need no sorting and little memory. Resolution: the bin width.
 */
export class GroupedHistogram {
  readonly counts: Float64Array;
  readonly bins: number;

  constructor(readonly groups: number, readonly min: number, readonly max: number, readonly binWidth: number) {
    this.bins = Math.ceil((max - min) / binWidth);
    this.counts = new Float64Array(groups * this.bins);
  }

  add(group: number, value: number, weight = 1): void {
    let bin = Math.floor((value - this.min) / this.binWidth);
    if (bin < 0) bin = 0; else if (bin >= this.bins) bin = this.bins - 1;
    this.counts[group * this.bins + bin] += weight;
  }

  /** The p-th percentiles (0–100) of one group, ascending; NaN when the group is empty. */
  percentiles(group: number, ps: readonly number[]): number[] {
    const base = group * this.bins;
    let total = 0;
    for (let b = 0; b < this.bins; b++) total += this.counts[base + b];
    if (total === 0) return ps.map(() => NaN);
    return ps.map((p) => {
      const target = (p / 100) * total;
      let cumulative = 0;
      for (let b = 0; b < this.bins; b++) {
        const c = this.counts[base + b];
        if (c > 0 && cumulative + c >= target) return this.min + (b + (target - cumulative) / c) * this.binWidth;
        cumulative += c;
      }
      return this.max;
    });
  }
}
