import type { StationClimate } from '../hydrology/stations';

/** One calendar month of one record: mean and total of its values, how many it holds and how many its steps would be. */
export interface MonthAggregate {
  /** YYYY-MM */
  month: string;
  mean: number;
  total: number;
  count: number;
  expected: number;
}

/** Share of a month's steps a record must hold for its mean (temperature) or total (precipitation) to count. */
export const MIN_MONTH_COMPLETENESS = { mean: 0.8, total: 0.9 } as const;

/**
 * Monthly climatology of a record: per calendar month (January first) the mean over the years of
 * the monthly means (temperature) or of the monthly totals (precipitation), counting only months
 * the record holds nearly completely (MIN_MONTH_COMPLETENESS; common practice for station
 * climatologies, cf. WMO's 3/5 rule for monthly means [memory]) — null where no year qualifies.
 */
export function monthlyClimatology(months: readonly MonthAggregate[], statistic: 'mean' | 'total'): (number | null)[] {
  const sums = new Array<number>(12).fill(0);
  const years = new Array<number>(12).fill(0);
  for (const m of months) {
    if (m.expected <= 0 || m.count / m.expected < MIN_MONTH_COMPLETENESS[statistic]) continue;
    const calendar = Number(m.month.slice(5, 7)) - 1;
    sums[calendar] += statistic === 'mean' ? m.mean : m.total;
    years[calendar] += 1;
  }
  return sums.map((s, i) => (years[i] > 0 ? s / years[i] : null));
}

/**
 * The period all records share (latest first day to earliest last day), or null when they do
 * not overlap. Stations are compared over their common period: climatologies of different
 * periods would mix the climate's changes with the stations' differences.
 */
export function commonPeriod(records: readonly { first: string; last: string }[]): { from: string; to: string } | null {
  if (records.length === 0) return null;
  const from = records.map((r) => r.first).sort().at(-1)!;
  const to = records.map((r) => r.last).sort()[0];
  return from <= to ? { from, to } : null;
}

/** A station's climatology for the gradient fits, from its monthly aggregates (either may be missing). */
export function stationClimate(name: string, elevationM: number, temperature: readonly MonthAggregate[] | null, precipitation: readonly MonthAggregate[] | null): StationClimate {
  return {
    name,
    elevationM,
    ...(temperature ? { monthlyTemperatureC: monthlyClimatology(temperature, 'mean') } : {}),
    ...(precipitation ? { monthlyPrecipitationMm: monthlyClimatology(precipitation, 'total') } : {}),
  };
}
