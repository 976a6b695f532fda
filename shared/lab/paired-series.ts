import { addDays } from '../melt/calendar';
import type { Period } from './site';

/** One observed value on one date. */
export interface DatedValue {
  date: string;
  value: number;
}

/** Observed and simulated values on the same dates, in date order. */
export interface PairedSeries {
  dates: string[];
  observed: number[];
  simulated: number[];
}

/**
 * Pairs observations with a daily simulated series (day d is startDate + d) inside the period;
 * days without an observation or outside the simulation are left out.
 */
export function pairDaily(observed: readonly DatedValue[], startDate: string, simulated: ArrayLike<number>, period: Period): PairedSeries {
  const byDate = new Map<string, number>();
  for (let d = 0; d < simulated.length; d++) byDate.set(addDays(startDate, d), simulated[d]);
  const pairs = observed
    .filter((o) => o.date >= period.from && o.date <= period.to && byDate.has(o.date) && Number.isFinite(o.value))
    .sort((a, b) => (a.date < b.date ? -1 : a.date > b.date ? 1 : 0));
  return { dates: pairs.map((o) => o.date), observed: pairs.map((o) => o.value), simulated: pairs.map((o) => byDate.get(o.date)!) };
}

/** Fewest paired days a month needs to count in monthly scores. */
export const MIN_DAYS_PER_MONTH = 20;

/** Monthly means of paired daily values (dates 'YYYY-MM'); months with fewer than MIN_DAYS_PER_MONTH days are left out. */
export function monthlyMeans(daily: PairedSeries): PairedSeries {
  const months = new Map<string, { o: number; s: number; n: number }>();
  daily.dates.forEach((date, i) => {
    const key = date.slice(0, 7);
    const m = months.get(key) ?? { o: 0, s: 0, n: 0 };
    m.o += daily.observed[i];
    m.s += daily.simulated[i];
    m.n += 1;
    months.set(key, m);
  });
  const kept = [...months.entries()].filter(([, m]) => m.n >= MIN_DAYS_PER_MONTH);
  return { dates: kept.map(([k]) => k), observed: kept.map(([, m]) => m.o / m.n), simulated: kept.map(([, m]) => m.s / m.n) };
}
