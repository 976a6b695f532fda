/**
 * Calendar helpers on local dates written 'YYYY-MM-DD'. Arithmetic runs on UTC midnights so the
 * host's own time zone never leaks in.
 */

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

/** Offsets already worked out, by zone and year: every simulation asks for its zone's (building the formatter takes most of a millisecond). */
const standardOffsets = new Map<string, number>();

/**
 * Standard (winter) offset of an IANA time zone from UTC in hours, the smaller of the offsets
 * on 1 January and 1 July of the year. Station loggers keep standard time all year, so forcing
 * hours are read as local standard time (no daylight-saving shifts).
 */
export function standardOffsetHours(timeZone: string, year: number): number {
  const key = `${timeZone}|${year}`;
  const known = standardOffsets.get(key);
  if (known !== undefined) return known;
  const format = new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'longOffset' });
  const offsetAt = (ms: number): number => {
    const part = format.formatToParts(new Date(ms)).find((p) => p.type === 'timeZoneName')?.value ?? 'GMT';
    const m = /GMT([+-])(\d{2}):(\d{2})/.exec(part);
    return m ? (m[1] === '-' ? -1 : 1) * (+m[2] + +m[3] / 60) : 0;
  };
  const offset = Math.min(offsetAt(Date.UTC(year, 0, 1)), offsetAt(Date.UTC(year, 6, 1)));
  if (standardOffsets.size >= 1000) standardOffsets.clear();
  standardOffsets.set(key, offset);
  return offset;
}

/** Zones already found known: building a formatter for a zone costs about half a millisecond, and every catchment write checks one. */
const knownTimeZones = new Set<string>();

/** True if the runtime knows the IANA time zone. */
export function isTimeZone(timeZone: string): boolean {
  if (knownTimeZones.has(timeZone)) return true;
  try {
    new Intl.DateTimeFormat('en-US', { timeZone });
  } catch {
    return false;
  }
  // Only known zones are kept, and no more than a thousand (spellings in other letter cases are known too).
  if (knownTimeZones.size < 1000) knownTimeZones.add(timeZone);
  return true;
}
