import { simulateSummary, type MemberInput } from '../../shared/analysis/simulate-summary';
import type { SimulationSummary } from '../../shared/analysis/simulation-summary';
import { SimulationPool } from '../../server/services/runs/simulation-pool';

/**
 * The run executor's simulation pool, but simulating on the calling thread: the demo seed runs
 * one short season, which takes less time than starting a worker thread. No thread is ever started.
 */
export class InProcessSimulations extends SimulationPool {
  constructor() {
    super(1);
  }

  override simulate(input: MemberInput, onProgress: (fraction: number) => void): Promise<SimulationSummary> {
    return Promise.resolve().then(() => simulateSummary(input, onProgress));
  }
}
