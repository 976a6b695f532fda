import type { LabTask } from '../../workers/lab-worker';
import { ThreadPool } from '../thread-pool';
import type { ThreadBudget } from '../thread-budget';

/**
 * Worker threads for the lab's computations (server/workers/lab-worker.ts). Curves and scores a
 * scientist waits for are interactive; sweeps and calibrations ask for batch priority.
 */
export class LabPool extends ThreadPool<LabTask, unknown> {
  constructor(budget: ThreadBudget) {
    super(new URL('../../workers/lab-worker.ts', import.meta.url), budget, 'interactive', true);
  }
}
