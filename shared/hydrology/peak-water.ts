import { refuse } from './errors';

/**
 * Peak water: the year of maximum annual glacier runoff, taken as the maximum of its centred
 * 11-year moving mean, as Huss & Hock 2018 (Nat. Clim. Change 8:135) do [memory]. The first and
 * last five years have no full window, so a maximum at either end of the smoothed series means the
 * peak lies at or before the start, or is not reached by the end.
 */

export interface PeakWater {
  /** Year of the smoothed maximum (null when the series is shorter than the window). */
  year: number | null;
  /** Smoothed glacier runoff in that year (the unit of the input). */
  value: number | null;
  /** 'reached' inside the run, 'at or before the start' (still falling from the first full window), or 'not reached' by the end. */
  status: 'reached' | 'at or before the start' | 'not reached' | 'too short';
  /** Centred moving mean (NaN where the window is not full). */
  smoothed: Float64Array;
}

/**
 * Centred moving mean over an odd window; NaN where the window is not full.
 * @example movingMean([1, 2, 3, 4, 5], 3) // [NaN, 2, 3, 4, NaN]
 */
export function movingMean(values: ArrayLike<number>, window: number): Float64Array {
  if (!Number.isInteger(window) || window < 1 || window % 2 === 0) throw new RangeError(`movingMean: the window ${window} must be an odd whole number`);
  const half = (window - 1) / 2;
  const out = new Float64Array(values.length).fill(Number.NaN);
  let sum = 0;
  for (let i = 0; i < values.length; i++) {
    sum += values[i];
    if (i >= window) sum -= values[i - window];
    if (i >= window - 1) out[i - half] = sum / window;
  }
  return out;
}

/**
 * @param years consecutive years
 * @param glacierRunoff annual glacier runoff per year (any unit, e.g. m³ or mm)
 * @throws HydrologyInputError when the series lengths differ or the years are not consecutive
 * @example peakWater(rows.map((r) => r.year), rows.map((r) => r.glacierRunoffM3)) // { year: 2061, status: 'reached', … }
 */
export function peakWater(years: ArrayLike<number>, glacierRunoff: ArrayLike<number>, window = 11): PeakWater {
  if (years.length !== glacierRunoff.length) refuse('glacierRunoff', `${years.length} years but ${glacierRunoff.length} values.`);
  for (let i = 1; i < years.length; i++) if (years[i] !== years[i - 1] + 1) refuse(`years[${i}]`, `the years must follow one another (${years[i - 1]} then ${years[i]}).`);
  for (let i = 0; i < glacierRunoff.length; i++) if (!Number.isFinite(glacierRunoff[i])) refuse(`glacierRunoff[${i}]`, 'is not a number.');
  const smoothed = movingMean(glacierRunoff, window);
  const half = (window - 1) / 2;
  if (years.length < window) return { year: null, value: null, status: 'too short', smoothed };
  let best = half;
  for (let i = half; i < years.length - half; i++) if (smoothed[i] > smoothed[best]) best = i;
  const status = best === half ? 'at or before the start' : best === years.length - half - 1 ? 'not reached' : 'reached';
  return { year: years[best], value: smoothed[best], status, smoothed };
}

/** Peak water of a baseline and its variants, with each variant's shift in years (variant − baseline). */
export function comparePeakWater(years: ArrayLike<number>, baseline: ArrayLike<number>, variants: Record<string, ArrayLike<number>>, window = 11): { baseline: PeakWater; variants: Record<string, PeakWater & { shiftYears: number | null }> } {
  const base = peakWater(years, baseline, window);
  const out: Record<string, PeakWater & { shiftYears: number | null }> = {};
  for (const [name, series] of Object.entries(variants)) {
    const peak = peakWater(years, series, window);
    out[name] = { ...peak, shiftYears: peak.year !== null && base.year !== null ? peak.year - base.year : null };
  }
  return { baseline: base, variants: out };
}
