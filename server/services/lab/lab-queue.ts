import type { Job } from 'bullmq';
import type { JobQueues } from '../../queue/job-queues';
import { CANCEL_LAB_CHANNEL, PRIORITY, type LabJobData } from '../../queue/jobs';
import { decodePayload, encodePayload } from '../../queue/job-payload';
import type { LabTask } from '../../workers/lab-worker';
import type { RunOptions } from '../thread-pool';

/** How the lab's computations are run: on the lab queue, by the worker processes. */
export interface LabRunner {
  /** Lab jobs split their work into about this many steps per worker thread in the installation. */
  readonly threads: number;
  run<R>(task: LabTask, options?: LabRunOptions): Promise<R>;
}

/**
 * A lab computation's options: those of a thread pool, the organisation it is for (the queue page
 * shows each its own) and, for a step of a lab job, a job id of its own (added again by a job
 * taken over after a fault, it finds the step there, done or under way, instead of doubling it).
 */
export type LabRunOptions = RunOptions & { organisationId: number; jobId?: string };

/**
 * The lab's computations as jobs on the `lab` queue: the API adds the task and waits for its
 * result, which a worker process computes on its lab threads. Curves a scientist waits for go
 * ahead of sweep and calibration steps; an aborted signal removes a waiting job or stops a running one.
 */
export class LabQueue implements LabRunner {
  constructor(private readonly queues: JobQueues, readonly threads: number) {}

  async run<R>(task: LabTask, options: LabRunOptions): Promise<R> {
    const { signal, onProgress } = options;
    signal?.throwIfAborted();
    const events = this.queues.labEvents();
    await events.waitUntilReady();
    const job: Job<LabJobData> = await this.queues.lab.add('lab', { organisationId: options.organisationId, task: encodePayload(task) }, {
      priority: PRIORITY[options.priority ?? 'interactive'],
      jobId: options.jobId,
      // A computation is worth retrying only after a fault (a worker lost); its own errors fail at once.
      attempts: 3, backoff: { type: 'fixed', delay: 200 },
      removeOnComplete: { age: 60 }, removeOnFail: { age: 24 * 3600, count: 1000 },
    });
    const progress = ({ jobId, data }: { jobId: string; data: unknown }) => {
      if (jobId === job.id && typeof data === 'number') onProgress?.(data);
    };
    const abort = () => {
      void job.remove().catch(() => this.queues.publish(CANCEL_LAB_CHANNEL, job.id!));
    };
    if (onProgress) events.on('progress', progress);
    signal?.addEventListener('abort', abort, { once: true });
    // Aborted while the job was being added: its listener came too late.
    if (signal?.aborted) abort();
    try {
      const finished = job.waitUntilFinished(events);
      const result = await (signal ? Promise.race([finished, aborted(signal)]) : finished);
      return decodePayload<R>(result as string);
    } finally {
      events.off('progress', progress);
      signal?.removeEventListener('abort', abort);
    }
  }
}

function aborted(signal: AbortSignal): Promise<never> {
  return new Promise((_resolve, reject) => {
    if (signal.aborted) reject(signal.reason);
    else signal.addEventListener('abort', () => reject(signal.reason), { once: true });
  });
}
