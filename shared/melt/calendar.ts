/**
 * Calendar helpers on local dates written 'YYYY-MM-DD'. Arithmetic runs on UTC midnights so the
 * host's own time zone never leaks in.
 */

import { remembered } from './remembered';

const DAY_MS = 86_400_000;

/** Milliseconds of the UTC midnight with the same calendar date, or NaN if the text is not a real date. */
export function dateToUtcMs(isoDate: string): number {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(isoDate);
  if (!m) return Number.NaN;
  const ms = Date.UTC(+m[1], +m[2] - 1, +m[3]);
  return new Date(ms).toISOString().slice(0, 10) === isoDate ? ms : Number.NaN;
}

export function isIsoDate(text: string): boolean {
  return !Number.isNaN(dateToUtcMs(text));
}

/** Whole days from a to b (b − a). */
export function daysBetween(a: string, b: string): number {
  return Math.round((dateToUtcMs(b) - dateToUtcMs(a)) / DAY_MS);
}

export function addDays(isoDate: string, days: number): string {
  return new Date(dateToUtcMs(isoDate) + days * DAY_MS).toISOString().slice(0, 10);
}

/** Day of year 1 … 366 and month 0 … 11 of a UTC-midnight timestamp. */
export function dayOfYear(utcMs: number): number {
  const d = new Date(utcMs);
  return Math.round((utcMs - Date.UTC(d.getUTCFullYear(), 0, 1)) / DAY_MS) + 1;
}

/**
 * Standard (winter) offset of an IANA time zone from UTC in hours, the smaller of the offsets
 * on 1 January and 1 July of the year. Station loggers keep standard time all year, so forcing
 * hours are read as local standard time (no daylight-saving shifts). Remembered by zone and year:
 * every simulation asks for its zone's, and building the formatter takes most of a millisecond.
 */
export const standardOffsetHours = remembered((timeZone: string, year: number): number => {
  const format = new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'longOffset' });
  const offsetAt = (ms: number): number => {
    const part = format.formatToParts(new Date(ms)).find((p) => p.type === 'timeZoneName')?.value ?? 'GMT';
    const m = /GMT([+-])(\d{2}):(\d{2})/.exec(part);
    return m ? (m[1] === '-' ? -1 : 1) * (+m[2] + +m[3] / 60) : 0;
  };
  return Math.min(offsetAt(Date.UTC(year, 0, 1)), offsetAt(Date.UTC(year, 6, 1)));
}, (timeZone, year) => `${timeZone}|${year}`, 1000);

/** True if the runtime knows the IANA time zone (remembered: a formatter costs about half a millisecond, and every catchment write checks one). */
export const isTimeZone = remembered((timeZone: string): boolean => {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone });
    return true;
  } catch {
    return false;
  }
}, (timeZone) => timeZone, 1000);
