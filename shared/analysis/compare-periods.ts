/** The fields of a run's results that say which days it covers. */
interface Covered {
  startDate: string;
  dayCount: number;
}

/**
 * Runs compared side by side must cover the same days: daily charts and totals are read day by
 * day. Keeps the runs covering the first one's period and lists the others.
 */
export function samePeriodAsFirst<T extends { results: Covered }>(items: readonly T[]): { kept: T[]; left: T[] } {
  const first = items[0]?.results;
  if (!first) return { kept: [], left: [] };
  const same = (it: T) => it.results.startDate === first.startDate && it.results.dayCount === first.dayCount;
  return { kept: items.filter(same), left: items.filter((it) => !same(it)) };
}
