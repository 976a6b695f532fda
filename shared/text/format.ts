/**
 * One locale for every date, time and number a person reads. The browser sets the display locale
 * once from the user's setting (default: the browser's language) with `setDisplayLocale`; the
 * server never sets it, so PDFs, mails and messages it writes stay in British English. Exports
 * write ISO dates (`isoDate`) whatever the setting.
 */
export type DateStyle = 'short' | 'medium' | 'long';

export interface DisplayLocale {
  /** A BCP 47 tag ('en-GB', 'de-CH', 'ne-NP'). */
  locale: string;
  dateStyle: DateStyle;
}

export const DEFAULT_DISPLAY_LOCALE: DisplayLocale = { locale: 'en-GB', dateStyle: 'medium' };
let current: DisplayLocale = DEFAULT_DISPLAY_LOCALE;

/** A tag Intl can use, or the default one. */
export function supportedLocale(tag: string | null | undefined): string {
  if (!tag) return DEFAULT_DISPLAY_LOCALE.locale;
  try {
    return Intl.NumberFormat.supportedLocalesOf([tag])[0] ?? DEFAULT_DISPLAY_LOCALE.locale;
  } catch {
    return DEFAULT_DISPLAY_LOCALE.locale;
  }
}

export function setDisplayLocale(next: Partial<DisplayLocale>): void {
  current = { locale: supportedLocale(next.locale ?? current.locale), dateStyle: next.dateStyle ?? current.dateStyle };
}

export const displayLocale = (): DisplayLocale => current;

/**
 * Float noise of differences (variant − baseline) snapped to zero: |v| below 1e-9 of the
 * quantity's scale is nothing a model resolves ("1.20829e-15" is 0).
 */
export function withoutNoise(value: number, scale = 1): number {
  return Math.abs(value) < 1e-9 * Math.max(1, Math.abs(scale)) ? 0 : value;
}

/**
 * A number for reading in the display locale: grouped, at most `decimals` decimals (exactly when
 * `fixed`), a real minus sign, never exponent notation; '–' for a missing value.
 */
export function formatDecimal(value: number | null | undefined, decimals = 2, options: { fixed?: boolean; locale?: string } = {}): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '–';
  const clean = withoutNoise(value) || 0; // also turns −0 into 0
  const text = new Intl.NumberFormat(options.locale ?? current.locale, {
    maximumFractionDigits: decimals, minimumFractionDigits: options.fixed ? decimals : 0,
  }).format(clean);
  return text.replace(/^-/, '−');
}

/** Significant figures kept on screen, per kind of quantity, and the finest decimal worth showing. */
export const QUANTITY_DIGITS = {
  /** mm w.e., mm */
  depth: { significant: 3, maxDecimals: 1 },
  /** m³, million m³ */
  volume: { significant: 3, maxDecimals: 3 },
  /** m³/s */
  discharge: { significant: 3, maxDecimals: 3 },
  /** W/m² */
  flux: { significant: 3, maxDecimals: 1 },
  /** albedo, fractions 0–1 */
  fraction: { significant: 2, maxDecimals: 2 },
  /** °C, K */
  temperature: { significant: 3, maxDecimals: 1 },
  /** days, counts */
  count: { significant: 6, maxDecimals: 0 },
  /** anything else read from a model */
  general: { significant: 4, maxDecimals: 3 },
  /** a parameter or scenario setting someone typed or a calibration search found (0.0015 keeps its decimals) */
  setting: { significant: 4, maxDecimals: 8 },
} as const;
export type Quantity = keyof typeof QUANTITY_DIGITS;

/** Decimals that show `significant` figures of `value`, within the quantity's finest decimal. */
export function decimalsFor(value: number, quantity: Quantity = 'general'): number {
  const { significant, maxDecimals } = QUANTITY_DIGITS[quantity];
  if (value === 0 || !Number.isFinite(value)) return 0;
  const magnitude = Math.floor(Math.log10(Math.abs(value)));
  return Math.max(0, Math.min(maxDecimals, significant - 1 - magnitude));
}

/** A model value for reading: the quantity's significant figures, no float noise, no exponent. */
export function formatQuantity(value: number | null | undefined, quantity: Quantity = 'general', locale?: string): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '–';
  const clean = withoutNoise(value);
  return formatDecimal(clean, decimalsFor(clean, quantity), { locale });
}

/**
 * A setting as a form field shows it: the quantity's significant figures as a plain number, whole
 * digits kept (−5.80327 → −5.803, 0.00153 → 0.00153, 3250 → 3250), float noise gone.
 */
export function roundForEntry(value: number, quantity: Quantity = 'setting'): number {
  if (!Number.isFinite(value)) return value;
  const clean = withoutNoise(value);
  return Number(clean.toFixed(decimalsFor(clean, quantity))) || 0;
}

/** A share as a percentage: 0.4567 → "45.7 %". */
export function formatPercent(share: number | null | undefined, decimals = 1): string {
  if (share === null || share === undefined || !Number.isFinite(share)) return '–';
  return `${formatDecimal(share * 100, decimals)} %`;
}

const DATE_ONLY = /^\d{4}-\d{2}-\d{2}$/;
/** A calendar day ("2026-12-02") is read as that day wherever the reader is; a timestamp as its instant. */
const toDate = (value: string | Date) => (value instanceof Date ? value : DATE_ONLY.test(value) ? new Date(`${value}T12:00:00Z`) : new Date(value));
const zoneFor = (value: string | Date) => (typeof value === 'string' && DATE_ONLY.test(value) ? 'UTC' : undefined);

/** A date in the display locale and date style; '—' for none. */
export function formatDate(value: string | Date | null | undefined): string {
  if (!value) return '—';
  return new Intl.DateTimeFormat(current.locale, { dateStyle: current.dateStyle, timeZone: zoneFor(value) }).format(toDate(value));
}

/**
 * A span of days in the display locale, "1 Apr 2024 to 30 Sept 2024". Timestamps of a record
 * ("2021-10-01T00:00") count by their calendar day as written: the station's day, wherever the reader is.
 */
export function formatPeriod(from: string | null | undefined, to: string | null | undefined): string {
  const day = (value: string | null | undefined) => formatDate(value && /^\d{4}-\d{2}-\d{2}/.test(value) ? value.slice(0, 10) : value);
  return `${day(from)} to ${day(to)}`;
}

/** A calendar day written alone ("2024-05-01"), not part of a timestamp, a file name or a longer number. */
const DAY_IN_TEXT = /(?<![\w-])(\d{4})-(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])(?![\w-])/g;

/**
 * A sentence with its ISO days written in the display locale. Texts the server writes for screens
 * and exports alike (a run's set-up, its calibration, the melt season) carry ISO days, which the
 * CSV keeps; screens and the PDF show them through this.
 */
export function formatDatesIn(text: string): string {
  return text.replace(DAY_IN_TEXT, (day) => formatDate(day));
}

/** A month's name (0 = January) in the display locale: 'long' ("September") or 'short' ("Sept"). */
export function formatMonth(month: number, width: 'long' | 'short' = 'long'): string {
  return new Intl.DateTimeFormat(current.locale, { month: width, timeZone: 'UTC' }).format(Date.UTC(2001, month, 15));
}

/** A calendar month ("2024-05") as "May 2024" in the display locale; anything else as it is. */
export function formatYearMonth(value: string): string {
  const month = /^(\d{4})-(0[1-9]|1[0-2])$/.exec(value);
  if (!month) return value;
  return new Intl.DateTimeFormat(current.locale, { month: 'short', year: 'numeric', timeZone: 'UTC' }).format(Date.UTC(Number(month[1]), Number(month[2]) - 1, 15));
}

/** A date and time of day (to the minute) in the display locale. */
export function formatDateTime(value: string | Date | null | undefined): string {
  if (!value) return '—';
  return new Intl.DateTimeFormat(current.locale, { dateStyle: current.dateStyle, timeStyle: 'short' }).format(toDate(value));
}

/** An amount in the smallest currency unit (cents, as the payment service sends them). */
export function formatMoney(amount: number, currency: string): string {
  return new Intl.NumberFormat(current.locale, { style: 'currency', currency: currency.toUpperCase() }).format(amount / 100);
}

/** The ISO day of a timestamp ("2026-12-02", UTC), for exports and file names. */
export const isoDate = (value: string | Date) => toDate(value).toISOString().slice(0, 10);
