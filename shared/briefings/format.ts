import type { Ranged } from '../schemas/briefings';

/** A number for reading: grouped thousands, `digits` significant decimals, a real minus sign. */
export function formatNumber(value: number | null, digits = 2): string {
  if (value === null || !Number.isFinite(value)) return '–';
  const text = value.toLocaleString('en-GB', { maximumFractionDigits: digits, minimumFractionDigits: 0 });
  return text.replace(/^-/, '−');
}

/** "12.3 (9.8 – 14.1)" when a range exists, else "12.3". */
export function formatRanged(r: Ranged, digits = 2): string {
  const main = formatNumber(r.value, digits);
  return r.low === null || r.high === null ? main : `${main} (${formatNumber(r.low, digits)} to ${formatNumber(r.high, digits)})`;
}
