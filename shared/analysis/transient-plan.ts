import { hydrologicalYearStartBefore } from '../melt/spin-up';
import { addDays } from '../melt/calendar';
import { refuse } from '../hydrology/errors';
import { recordYearSequence } from '../hydrology/record-years';
import { transientYears, type TransientYear } from '../hydrology/transient-run';
import { warmingPath } from '../hydrology/warming-path';
import type { TransientOptions } from '../schemas/runs';

/** One complete mass-balance year of the station record, named by the calendar year it ends in. */
export interface RecordYear {
  year: number;
  from: string;
  to: string;
}

/**
 * The complete mass-balance years of a record (1 October to 30 September in the northern
 * hemisphere, 1 April to 31 March in the southern; common practice), named by the year they end in.
 * @example completeRecordYears({ from: '2021-10-01', to: '2024-09-30' }, 34).map((y) => y.year) // [2022, 2023, 2024]
 */
export function completeRecordYears(record: { from: string; to: string }, latitudeDeg: number): RecordYear[] {
  const years: RecordYear[] = [];
  // The first year starting on or after the record's first day.
  let from = hydrologicalYearStartBefore(addDays(record.from, 1), latitudeDeg);
  if (from < record.from) from = `${Number(from.slice(0, 4)) + 1}${from.slice(4)}`;
  for (;;) {
    const next = `${Number(from.slice(0, 4)) + 1}${from.slice(4)}`;
    const to = addDays(next, -1);
    if (to > record.to) return years;
    years.push({ year: Number(to.slice(0, 4)), from, to });
    from = next;
  }
}

export interface TransientPlan {
  years: TransientYear[];
  /** Record year → the dates its weather is read from. */
  periods: Record<number, { from: string; to: string }>;
  /** Global warming above 1850–1900 in each scenario year, °C. */
  globalWarmingC: number[];
}

/**
 * The scenario years of a multi-decade run: each takes the weather of one record year (in order or
 * resampled) warmed along the path to the warming level, which starts from the warming already in
 * the record (its middle year stands for it).
 * @throws HydrologyInputError naming the option that cannot be planned (a record without a complete year, a target before the record)
 */
export function planTransient(options: TransientOptions, record: readonly RecordYear[]): TransientPlan {
  if (record.length === 0) refuse('recordYears', 'the climate record holds no complete mass-balance year (1 October to 30 September, or 1 April to 31 March in the south); a multi-decade run repeats whole years.');
  const recordYear = record[Math.floor((record.length - 1) / 2)].year;
  const path = warmingPath({
    fromYear: options.fromYear, toYear: options.fromYear + options.years - 1, warmingLevelC: options.warmingLevelC, targetYear: options.targetYear,
    recordYear, regionalFactor: options.regionalFactor, precipitationChangeAtTarget: options.precipitationChangePercent / 100,
  });
  const sequence = recordYearSequence(record.map((r) => r.year), options.years, options.recordYears, options.seed);
  return {
    years: transientYears(path, sequence),
    periods: Object.fromEntries(record.map((r) => [r.year, { from: r.from, to: r.to }])),
    globalWarmingC: Array.from(path.globalWarmingC),
  };
}
