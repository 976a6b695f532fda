import { variableSpec, type TimeStep, type Variable } from '../../../../shared/schemas/dataset-variables';
import type { Problem } from '../../../../shared/schemas/datasets';
import { formatMinutes, STEP_MINUTES } from './timestamps';

type Report = (problem: Problem) => void;

/**
 * The time step of a series: the most common spacing of its timestamps. A step the user chose
 * that the timestamps contradict, or one the variable cannot have, is an error for the whole file.
 */
export function detectTimeStep(minutes: number[], requested: TimeStep | undefined, variable: Variable, report: Report): { step: TimeStep; note: string } {
  const spacing = commonSpacing(minutes);
  const detected: TimeStep | undefined = spacing === 60 ? 'hourly' : spacing === 1440 ? 'daily' : undefined;
  const spec = variableSpec(variable);
  const fail = (message: string) => report({ kind: 'step_mismatch', severity: 'error', row: 0, column: '', message });
  if (spacing !== undefined && !detected) fail(`timestamps are mostly ${spacing} minutes apart; hourly or daily values are needed`);
  if (requested && detected && requested !== detected) fail(`you chose ${requested} values but the timestamps are ${detected === 'hourly' ? 'one hour' : 'one day'} apart`);
  const step = requested ?? detected ?? spec.steps[0];
  if (!spec.steps.includes(step)) fail(`${spec.label.toLowerCase()} must be ${spec.steps.join(' or ')}; this file is ${step}`);
  const note = requested ? `${cap(step)}, as chosen.` : detected ? `${cap(step)}, detected from the timestamps.` : `${cap(step)}, assumed (too few rows to detect).`;
  return { step, note };
}

/**
 * Checks order and spacing of the rows that hold values: out-of-order and duplicated timestamps
 * and off-step times are errors; gaps are listed as ranges and kept as gaps.
 */
export function checkSeriesTimes(minutes: number[], lines: number[], step: TimeStep, column: string, report: Report): void {
  const size = STEP_MINUTES[step];
  for (let i = 0; i < minutes.length; i++) {
    if (minutes[i] % size !== 0) {
      report({ kind: 'step_mismatch', severity: 'error', row: lines[i], column, message: `${formatMinutes(minutes[i], 'hourly')} is not on a whole ${step === 'hourly' ? 'hour' : 'day'}` });
    }
    if (i === 0) continue;
    const difference = minutes[i] - minutes[i - 1];
    if (difference < 0) {
      report({ kind: 'out_of_order', severity: 'error', row: lines[i], column, message: `${formatMinutes(minutes[i], step)} comes after ${formatMinutes(minutes[i - 1], step)} (line ${lines[i - 1]}); sort rows by time` });
    } else if (difference === 0) {
      report({ kind: 'duplicate', severity: 'error', row: lines[i], column, message: `${formatMinutes(minutes[i], step)} appears again (first on line ${lines[i - 1]})` });
    } else if (difference > size) {
      const missing = Math.round(difference / size) - 1;
      report({
        kind: 'gap', severity: 'warning', row: lines[i], column,
        message: `no values from ${formatMinutes(minutes[i - 1] + size, step)} to ${formatMinutes(minutes[i] - size, step)} (${missing} ${step === 'hourly' ? 'hour' : 'day'}${missing === 1 ? '' : 's'}); kept as a gap`,
      });
    }
  }
}

/** The most frequent positive spacing in minutes among the first rows, or undefined for fewer than two rows. */
function commonSpacing(minutes: number[]): number | undefined {
  const tally = new Map<number, number>();
  for (let i = 1; i < Math.min(minutes.length, 2000); i++) {
    const d = minutes[i] - minutes[i - 1];
    if (d > 0) tally.set(d, (tally.get(d) ?? 0) + 1);
  }
  let best: number | undefined;
  for (const [d, n] of tally) if (best === undefined || n > tally.get(best)! || (n === tally.get(best) && d < best)) best = d;
  return best;
}

function cap(text: string): string {
  return text[0].toUpperCase() + text.slice(1);
}
