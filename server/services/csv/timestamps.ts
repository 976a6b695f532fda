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
  const [year, month, day, hour = 0, minute = 0, second = 0] = m.slice(1).map((v) => (v === undefined ? 0 : Number(v)));
  if (month < 1 || month > 12 || day < 1 || hour > 24 || minute > 59 || second > 59) return null;
  const ms = Date.UTC(year, month - 1, day, hour, minute, second);
  const check = new Date(Date.UTC(year, month - 1, day));
  if (check.getUTCDate() !== day || check.getUTCMonth() !== month - 1) return null;
  return ms / 60_000;
}

/** '2024-03-01 13:00' for hourly, '2024-03-01' for daily. */
export function formatMinutes(minutes: number, step: 'hourly' | 'daily'): string {
  const iso = new Date(minutes * 60_000).toISOString();
  return step === 'daily' ? iso.slice(0, 10) : `${iso.slice(0, 10)} ${iso.slice(11, 16)}`;
}

export const STEP_MINUTES = { hourly: 60, daily: 1440 } as const;
