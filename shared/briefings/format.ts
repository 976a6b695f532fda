import type { Ranged } from '../schemas/briefings';
import { formatNumber } from '../text/numbers';

/** What the timing shift measures (shared/analysis/added-melt-totals.ts), in the reader's words. */
export const TIMING_NOTE = 'shift of the date by which half of the melt has run off; negative = earlier';

/** "12.3 (9.8 to 14.1)" when a range exists, else "12.3". */
export function formatRanged(r: Ranged, digits = 2): string {
  const main = formatNumber(r.value, digits);
  return r.low === null || r.high === null ? main : `${main} (${formatNumber(r.low, digits)} to ${formatNumber(r.high, digits)})`;
}

/** The same ranged figure in another unit, e.g. m³ → million m³ with factor 1e-6. */
export function scaleRanged(r: Ranged, factor: number): Ranged {
  const scale = (x: number | null) => (x === null ? null : x * factor);
  return { value: scale(r.value), low: scale(r.low), high: scale(r.high) };
}
