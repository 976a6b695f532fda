import type { MemberInput, MemberSummary } from '../../../shared/analysis/simulate-summary';
import { ThreadPool } from '../thread-pool';
import type { ThreadBudget } from '../thread-budget';

/** A worker process's threads that run the melt engine for run members (server/workers/simulate-worker.ts); background work. */
export class SimulationPool extends ThreadPool<MemberInput, MemberSummary> {
  constructor(budget: ThreadBudget) {
    super(new URL('../../workers/simulate-worker.ts', import.meta.url), budget, 'batch', true);
  }

  simulate(input: MemberInput, onProgress: (fraction: number) => void, signal?: AbortSignal): Promise<MemberSummary> {
    return this.run(input, { onProgress, signal });
  }
}
