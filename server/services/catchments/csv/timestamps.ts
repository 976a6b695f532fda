/**
 * Timestamps in uploaded series: ISO dates with an optional time ('2024-03-01', '2024-03-01 13:00',
 * '2024-03-01T13:00:00'), also with slashes. They are read as the station's local time and kept as
 * minutes on a UTC-based clock, so arithmetic never sees the server's own time zone.
 */
const PATTERN = /^(\d{4})[-/](\d{1,2})[-/](\d{1,2})(?:[T ](\d{1,2}):(\d{2})(?::(\d{2}))?)?$/;

/** Minutes since 1970-01-01 00:00 of the written local time, or null if it is not a real date and time. */
export function parseTimestamp(cell: string): number | null {
  const m = PATTERN.exec(cell);
  if (!m) return null;
  const year = +m[1];
  const month = +m[2];
  const day = +m[3];
  const hour = m[4] === undefined ? 0 : +m[4];
  const minute = m[5] === undefined ? 0 : +m[5];
  const second = m[6] === undefined ? 0 : +m[6];
  if (month < 1 || month > 12 || day < 1 || day > daysInMonth(year, month) || hour > 24 || minute > 59 || second > 59) return null;
  return Date.UTC(year, month - 1, day, hour, minute, second) / 60_000;
}

const DAYS_IN_MONTH = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];
function daysInMonth(year: number, month: number): number {
  const leap = (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
  return month === 2 && leap ? 29 : DAYS_IN_MONTH[month - 1];
}

/** '2024-03-01 13:00' for hourly, '2024-03-01' for daily. */
export function formatMinutes(minutes: number, step: 'hourly' | 'daily'): string {
  const iso = new Date(minutes * 60_000).toISOString();
  return step === 'daily' ? iso.slice(0, 10) : `${iso.slice(0, 10)} ${iso.slice(11, 16)}`;
}

export const STEP_MINUTES = { hourly: 60, daily: 1440 } as const;
