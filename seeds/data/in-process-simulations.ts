import { simulateMember } from '../../shared/analysis/simulate-summary';
import type { Simulator } from '../../server/services/runs/simulator';

/**
 * Simulates on the calling thread: the demo seed runs one short season, which takes less time
 * than starting a worker thread, so no thread is ever started.
 */
export const inProcessSimulator: Simulator = {
  threads: 1,
  simulate: (input, onProgress) => Promise.resolve().then(() => simulateMember(input, onProgress)),
};
