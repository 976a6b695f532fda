import type { SimulationSummary } from '../../shared/analysis/simulation-summary';
import { simulateSummary, type MemberInput } from '../../shared/analysis/simulate-summary';
import type { PooledTask } from '../services/thread-pool';

/** Runs one simulation in a worker thread and returns what a run stores; progress after each month. */
export default function simulateTask({ task: input, progress }: PooledTask<MemberInput>): SimulationSummary {
  try {
    return simulateSummary(input, (fraction) => progress.postMessage(fraction));
  } finally {
    progress.close();
  }
}
