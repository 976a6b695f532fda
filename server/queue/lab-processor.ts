import { UnrecoverableError, type Job } from 'bullmq';
import type { Logger } from '../logger';
import type { LabPool } from '../services/lab/lab-pool';
import { PRIORITY } from './jobs';
import type { LabJobData } from './jobs';
import { decodePayload, encodePayload } from './job-payload';
import type { LabTask } from '../workers/lab-worker';

const PROGRESS_EVERY_MS = 250;

/**
 * Runs one lab computation on the worker's lab threads and returns its result (structured-clone
 * bytes). A computation that throws fails once with its message, which the API passes on; a
 * cancelled one stops. Interactive ones go before sweep and calibration steps on the threads too.
 */
export function labProcessor(pool: LabPool, logger: Logger) {
  return async (job: Job<LabJobData>, _token?: string, signal?: AbortSignal): Promise<string> => {
    const task = decodePayload<LabTask>(job.data.task);
    const log = logger.child({ jobId: job.id, kind: task.kind });
    let last = 0;
    const onProgress = (fraction: number) => {
      if (Date.now() - last < PROGRESS_EVERY_MS) return;
      last = Date.now();
      void job.updateProgress(fraction).catch(() => undefined);
    };
    const priority = (job.opts.priority ?? PRIORITY.interactive) <= PRIORITY.interactive ? 'interactive' : 'batch';
    try {
      const result = await pool.run(task, { onProgress, signal, priority });
      log.info('lab computation done');
      return encodePayload(result);
    } catch (error) {
      if (signal?.aborted) throw new UnrecoverableError('Cancelled.');
      throw new UnrecoverableError(error instanceof Error ? error.message : String(error));
    }
  };
}
