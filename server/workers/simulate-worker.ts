import { simulateMember, type MemberInput, type MemberSummary } from '../../shared/analysis/simulate-summary';
import type { PooledTask } from '../services/thread-pool';

/** Runs one member in a worker thread and returns what a run stores; progress after each month (or year of a multi-decade run). */
export default function simulateTask({ task: input, progress }: PooledTask<MemberInput>): MemberSummary {
  try {
    return simulateMember(input, (fraction) => progress.postMessage(fraction));
  } finally {
    progress.close();
  }
}
