import { seededRandom } from '../analysis/random';
import { refuse } from './errors';

/**
 * Which year of the station record stands in for each year of a transient scenario: the record
 * repeated in order, or resampled — whole years drawn with replacement by a seeded generator, so a
 * run can be reproduced (common practice for delta-change scenarios on a short record).
 *
 * @param recordYears the complete years of the record, e.g. [2011, …, 2020]
 * @param count number of scenario years
 * @example recordYearSequence([2011, 2012, 2013], 5, 'repeat') // [2011, 2012, 2013, 2011, 2012]
 */
export function recordYearSequence(recordYears: readonly number[], count: number, mode: 'repeat' | 'resample', seed = 1): number[] {
  if (recordYears.length === 0) refuse('recordYears', 'the station record has no complete year.');
  if (!Number.isInteger(count) || count < 1) refuse('count', `the scenario needs at least one year (got ${count}).`);
  if (mode === 'repeat') return Array.from({ length: count }, (_, i) => recordYears[i % recordYears.length]);
  const random = seededRandom(seed);
  return Array.from({ length: count }, () => recordYears[Math.floor(random() * recordYears.length)]);
}
