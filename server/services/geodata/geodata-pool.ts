import type { GeodataOutcome, GeodataRefused, GeodataTask } from '../../workers/geodata-worker';
import { AppError } from '../../errors';
import { ThreadPool, type RunOptions } from '../thread-pool';
import type { ThreadBudget } from '../thread-budget';

/**
 * Worker threads for reading geodata, deriving bands and reducing observations
 * (server/workers/geodata-worker.ts); a user waits for each. A refused input comes back as the
 * API's error: 413 for a file over the limits, otherwise 422 with the check's code and field.
 */
export class GeodataPool extends ThreadPool<GeodataTask, GeodataOutcome | GeodataRefused> {
  constructor(budget: ThreadBudget) {
    super(new URL('../../workers/geodata-worker.ts', import.meta.url), budget, 'interactive');
  }

  async work<R extends GeodataOutcome>(task: GeodataTask, options: RunOptions = {}): Promise<R> {
    const outcome = await this.run<R | GeodataRefused>(task, options);
    if ('refused' in outcome) {
      const { code, message, field, details } = outcome.refused;
      throw new AppError(code === 'too_large' ? 413 : 422, code, message, field, details);
    }
    return outcome;
  }
}
