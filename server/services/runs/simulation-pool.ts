import type { SimulationSummary } from '../../../shared/analysis/simulation-summary';
import type { MemberInput } from '../../../shared/analysis/simulate-summary';
import { ThreadPool } from '../thread-pool';

/** Worker threads that run the melt engine for runs (server/workers/simulate-worker.ts). */
export class SimulationPool extends ThreadPool<MemberInput, SimulationSummary> {
  constructor(threads: number) {
    super(new URL('../../workers/simulate-worker.ts', import.meta.url), threads);
  }

  /** Simulates one engine input; rejects with an AbortError when `signal` aborts. */
  simulate(input: MemberInput, onProgress: (fraction: number) => void, signal?: AbortSignal): Promise<SimulationSummary> {
    return this.run(input, onProgress, signal);
  }
}
