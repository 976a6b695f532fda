import type { MessagePort } from 'node:worker_threads';
import type { SimulationSummary } from '../../shared/analysis/simulation-summary';
import { simulateSummary, type MemberInput } from '../../shared/analysis/simulate-summary';

export interface SimulateTask {
  input: MemberInput;
  /** Receives the fraction simulated (0 … 1) after each month. */
  progress: MessagePort;
}

/** Runs one simulation in a worker thread and returns what a run stores. */
export default function simulateTask({ input, progress }: SimulateTask): SimulationSummary {
  try {
    return simulateSummary(input, (fraction) => progress.postMessage(fraction));
  } finally {
    progress.close();
  }
}
