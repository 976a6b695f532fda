import type { TimeStep } from '../../../shared/schemas/dataset-variables';
import { formatMinutes, parseTimestamp, STEP_MINUTES } from './csv/timestamps';

/**
 * Lays stored values on a regular grid of steps from `first` to `last` (local times), with null
 * wherever no value was stored, so charts and the engine see gaps as gaps.
 */
export function valuesOnGrid(
  rows: readonly { t: string; value: number }[],
  step: TimeStep,
  first: string,
  last: string,
): { times: string[]; values: (number | null)[] } {
  const size = STEP_MINUTES[step];
  const start = parseTimestamp(first)!;
  const count = Math.max(0, Math.round((parseTimestamp(last)! - start) / size) + 1);
  const values: (number | null)[] = new Array(count).fill(null);
  for (const row of rows) {
    const index = Math.round((parseTimestamp(row.t)! - start) / size);
    if (index >= 0 && index < count) values[index] = row.value;
  }
  const times = Array.from({ length: count }, (_, i) => formatMinutes(start + i * size, step));
  return { times, values };
}

/** Number of steps from first to last inclusive. */
export function stepsBetween(first: string, last: string, step: TimeStep): number {
  return Math.round((parseTimestamp(last)! - parseTimestamp(first)!) / STEP_MINUTES[step]) + 1;
}
