import { formatDecimal } from './format';

/**
 * Rounding and number formatting, one meaning each, for every screen, chart, export and PDF.
 * Formatting follows the display locale of shared/text/format.ts (British English unless the
 * browser set the user's own).
 */

/** `value` to `decimals` places (half away from zero for positive halves, as Math.round). */
export function roundTo(value: number, decimals: number): number {
  const scale = 10 ** decimals;
  return Math.round(value * scale) / scale;
}

/** `value` to `digits` significant digits: what charts and tables keep of long model output. */
export function roundSignificant(value: number, digits: number): number {
  return Number(value.toPrecision(digits));
}

/**
 * A number for reading: thousands grouped, at most `digits` decimals (exactly `digits` when
 * `fixed`), a real minus sign; '–' for a missing value.
 */
export function formatNumber(value: number | null | undefined, digits = 2, options: { fixed?: boolean } = {}): string {
  return formatDecimal(value, digits, options);
}
