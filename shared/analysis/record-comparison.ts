/** One day's value of a record (a daily mean or daily total), date YYYY-MM-DD. */
export interface DailyValue {
  date: string;
  value: number;
}

export interface RecordComparison {
  /** First and last day both records hold; null when they do not overlap. */
  commonPeriod: { from: string; to: string } | null;
  days: number;
  meanFirst: number | null;
  meanSecond: number | null;
  /** Mean of second − first. */
  bias: number | null;
  /** Pearson correlation coefficient; null with fewer than three days or a record that does not vary. */
  correlation: number | null;
  /** √(mean of (second − first)²). */
  rmsDifference: number | null;
  dates: string[];
  firstValues: number[];
  secondValues: number[];
}

/**
 * Two daily records compared on the days both hold a value (no gap filling, no merging): the
 * mean bias (second − first), Pearson's correlation and the root-mean-square difference — the
 * usual measures for overlapping station records (common practice, e.g. WMO guidance on
 * homogenising climate series [memory]).
 *
 * @example compareDailyRecords([{ date: '2024-01-01', value: 1 }], [{ date: '2024-01-01', value: 2 }]).bias // 1
 */
export function compareDailyRecords(first: readonly DailyValue[], second: readonly DailyValue[]): RecordComparison {
  const other = new Map(second.map((v) => [v.date, v.value]));
  const dates: string[] = [];
  const a: number[] = [];
  const b: number[] = [];
  for (const v of [...first].sort((x, y) => (x.date < y.date ? -1 : x.date > y.date ? 1 : 0))) {
    const w = other.get(v.date);
    if (w === undefined || !Number.isFinite(v.value) || !Number.isFinite(w)) continue;
    dates.push(v.date);
    a.push(v.value);
    b.push(w);
  }
  const n = dates.length;
  if (n === 0) return { commonPeriod: null, days: 0, meanFirst: null, meanSecond: null, bias: null, correlation: null, rmsDifference: null, dates, firstValues: a, secondValues: b };
  const mean = (x: number[]) => x.reduce((s, v) => s + v, 0) / x.length;
  const ma = mean(a);
  const mb = mean(b);
  let sab = 0;
  let saa = 0;
  let sbb = 0;
  let sdd = 0;
  for (let i = 0; i < n; i++) {
    sab += (a[i] - ma) * (b[i] - mb);
    saa += (a[i] - ma) ** 2;
    sbb += (b[i] - mb) ** 2;
    sdd += (b[i] - a[i]) ** 2;
  }
  const correlation = n >= 3 && saa > 0 && sbb > 0 ? sab / Math.sqrt(saa * sbb) : null;
  return {
    commonPeriod: { from: dates[0], to: dates[n - 1] }, days: n, meanFirst: ma, meanSecond: mb, bias: mb - ma,
    correlation, rmsDifference: Math.sqrt(sdd / n), dates, firstValues: a, secondValues: b,
  };
}
