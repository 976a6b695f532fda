import { addDays, dateToUtcMs, dayOfYear, standardOffsetHours } from './calendar';

/** The simulated days: where they sit in the forcing and what calendar they fall on. */
export interface Timeline {
  /** Index of the first simulated day in the forcing. */
  firstDay: number;
  dayCount: number;
  /** Local date of the first simulated day, YYYY-MM-DD. */
  startDate: string;
  /** Month 0 … 11 of each simulated day. */
  months: Uint8Array;
  /** Day of year 1 … 366 of each simulated day. */
  daysOfYear: Uint16Array;
  /** UTC milliseconds of local standard-time midnight starting each simulated day. */
  dayStartUtcMs: Float64Array;
}

export function buildTimeline(forcingStart: string, forcingDays: number, timeZone: string, period?: { from: string; to: string }): Timeline {
  const startMs = dateToUtcMs(forcingStart);
  const firstDay = period ? Math.round((dateToUtcMs(period.from) - startMs) / 86_400_000) : 0;
  const lastDay = period ? Math.round((dateToUtcMs(period.to) - startMs) / 86_400_000) : forcingDays - 1;
  const dayCount = lastDay - firstDay + 1;
  const startDate = addDays(forcingStart, firstDay);
  const offsetMs = standardOffsetHours(timeZone, new Date(dateToUtcMs(startDate)).getUTCFullYear()) * 3_600_000;
  const months = new Uint8Array(dayCount);
  const daysOfYear = new Uint16Array(dayCount);
  const dayStartUtcMs = new Float64Array(dayCount);
  for (let d = 0; d < dayCount; d++) {
    const midnight = dateToUtcMs(startDate) + d * 86_400_000;
    months[d] = new Date(midnight).getUTCMonth();
    daysOfYear[d] = dayOfYear(midnight);
    dayStartUtcMs[d] = midnight - offsetMs;
  }
  return { firstDay, dayCount, startDate, months, daysOfYear, dayStartUtcMs };
}
