import type { MessagePort } from 'node:worker_threads';
import { simulate } from '../../shared/melt/simulate';
import { summariseSimulation, type SimulationSummary } from '../../shared/analysis/simulation-summary';

export interface SimulateTask {
  input: unknown;
  /** Receives the fraction simulated (0 … 1) after each month. */
  progress: MessagePort;
}

/** Runs one simulation in a worker thread and returns what a run stores. */
export default function simulateTask({ input, progress }: SimulateTask): SimulationSummary {
  try {
    return summariseSimulation(simulate(input, { onProgress: (p) => progress.postMessage(p.fraction) }));
  } finally {
    progress.close();
  }
}
