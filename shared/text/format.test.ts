import { afterEach, describe, expect, it } from 'vitest';
import { DEFAULT_DISPLAY_LOCALE, decimalsFor, formatDate, formatDatesIn, formatDateTime, formatDecimal, formatMoney, formatMonth, formatYearMonth, formatPercent, formatPeriod, formatQuantity, isoDate, roundForEntry, setDisplayLocale, supportedLocale, withoutNoise } from './format';

afterEach(() => setDisplayLocale(DEFAULT_DISPLAY_LOCALE));

describe('one locale for dates and numbers', () => {
  it('writes numbers in the display locale, with a real minus sign', () => {
    expect(formatDecimal(1234567.891)).toBe('1,234,567.89');
    setDisplayLocale({ locale: 'de-DE' });
    expect(formatDecimal(1234567.891)).toBe('1.234.567,89');
    setDisplayLocale({ locale: 'de-CH' });
    expect(formatDecimal(-1234.5, 1)).toMatch(/^−1['’]234\.5$/);
    setDisplayLocale({ locale: 'en-IN' });
    expect(formatDecimal(12345678)).toBe('1,23,45,678');
  });

  it('keeps the significant figures of each quantity and never writes float noise or exponents', () => {
    expect(formatQuantity(1.20829e-15, 'depth')).toBe('0');
    expect(formatQuantity(-5.80327, 'depth')).toBe('−5.8');
    expect(formatQuantity(1234.567, 'depth')).toBe('1,235');
    expect(formatQuantity(0.0123456, 'discharge')).toBe('0.012');
    expect(formatQuantity(0.345678, 'fraction')).toBe('0.35');
    expect(formatQuantity(12345678.9, 'volume')).toBe('12,345,679');
    expect(formatQuantity(1e21)).not.toMatch(/e/i);
    expect(formatQuantity(null)).toBe('–');
    expect(formatDecimal(-0)).toBe('0');
    expect(decimalsFor(0.000123, 'general')).toBe(3);
    expect(withoutNoise(3e-12)).toBe(0);
    expect(withoutNoise(0.001)).toBe(0.001);
    expect(formatPercent(0.4567)).toBe('45.7 %');
  });

  it('shows a setting in a form field to four significant figures, whole digits and small decimals kept', () => {
    expect(roundForEntry(-5.80327)).toBe(-5.803);
    expect(roundForEntry(1.49574)).toBe(1.496);
    expect(roundForEntry(0.00153219)).toBe(0.001532);
    expect(roundForEntry(3250)).toBe(3250);
    expect(roundForEntry(123456.7)).toBe(123457);
    expect(roundForEntry(2.0000000000000004)).toBe(2);
    expect(roundForEntry(-1e-15)).toBe(0);
    expect(formatQuantity(0.0015, 'setting')).toBe('0.0015');
  });

  it('writes a span of days by their calendar days', () => {
    expect(formatPeriod('2024-04-01', '2024-09-30')).toBe('1 Apr 2024 to 30 Sept 2024');
    expect(formatPeriod('2021-10-01T00:00:00', '2024-09-30T23:00:00')).toBe('1 Oct 2021 to 30 Sept 2024');
  });

  it('writes dates in the chosen style, a calendar day as that day everywhere, ISO in exports', () => {
    expect(formatDate('2026-12-02')).toBe('2 Dec 2026');
    setDisplayLocale({ locale: 'en-US', dateStyle: 'short' });
    expect(formatDate('2026-12-02')).toBe('12/2/26');
    setDisplayLocale({ locale: 'de-CH', dateStyle: 'long' });
    expect(formatDate('2026-12-02')).toBe('2. Dezember 2026');
    expect(formatDateTime('2026-12-02T14:30:00Z')).toMatch(/^2\. Dezember 2026 um \d{2}:30$/);
    expect(isoDate('2026-12-02T23:30:00Z')).toBe('2026-12-02');
    expect(formatDate(null)).toBe('—');
  });

  it('writes the ISO days of a sentence in the display locale, and nothing else that looks like one', () => {
    const text = 'the calibration saved on 2026-12-02 by Ana (2021-10-01 to 2024-09-30, KGE 0.81)';
    expect(formatDatesIn(text)).toBe('the calibration saved on 2 Dec 2026 by Ana (1 Oct 2021 to 30 Sept 2024, KGE 0.81)');
    setDisplayLocale({ locale: 'en-US', dateStyle: 'medium' });
    expect(formatDatesIn('melt season 2024-05-01 to 2024-09-30')).toBe('melt season May 1, 2024 to Sep 30, 2024');
    // A timestamp, a file name, a month that is not one and a longer number stay as written.
    for (const kept of ['at 2024-05-01T06:00', 'station-2024-05-01.csv', 'code 2024-13-01', 'id 12024-05-01']) expect(formatDatesIn(kept)).toBe(kept);
  });

  it('names months in the display locale', () => {
    expect([formatMonth(0), formatMonth(8, 'short')]).toEqual(['January', 'Sept']);
    expect([formatYearMonth('2024-05'), formatYearMonth('2024-13'), formatYearMonth('Kolvi')]).toEqual(['May 2024', '2024-13', 'Kolvi']);
    setDisplayLocale({ locale: 'de-CH' });
    expect(formatMonth(2)).toBe('März');
  });

  it('formats money in the display locale and falls back for a tag Intl cannot use', () => {
    expect(formatMoney(123450, 'eur')).toBe('€1,234.50');
    expect(supportedLocale('not a locale!')).toBe('en-GB');
    expect(supportedLocale(undefined)).toBe('en-GB');
  });
});
