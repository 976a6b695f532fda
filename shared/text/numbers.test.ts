import { describe, expect, it } from 'vitest';
import { formatNumber, roundSignificant, roundTo } from './numbers';

describe('numbers for reading', () => {
  it('rounds to decimal places', () => {
    expect(roundTo(3.14159, 2)).toBe(3.14);
    expect(roundTo(2.5, 0)).toBe(3);
    expect(roundTo(-1.25, 1)).toBe(-1.2);
    expect(roundTo(1234.5678, 3)).toBe(1234.568);
  });

  it('rounds to significant digits, whatever the magnitude', () => {
    expect(roundSignificant(123456.789, 6)).toBe(123457);
    expect(roundSignificant(0.000123456, 3)).toBe(0.000123);
  });

  it('groups thousands, writes a real minus sign and a dash for a missing value', () => {
    expect(formatNumber(1234567.891)).toBe('1,234,567.89');
    expect(formatNumber(-0.5, 1)).toBe('−0.5');
    expect(formatNumber(2, 2)).toBe('2');
    expect(formatNumber(2, 2, { fixed: true })).toBe('2.00');
    expect(formatNumber(null)).toBe('–');
    expect(formatNumber(Number.NaN)).toBe('–');
  });
});
