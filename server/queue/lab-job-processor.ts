import { UnrecoverableError, type Job } from 'bullmq';
import type { Knex } from 'knex';
import type { Logger } from '../logger';
import { performLabJob, type LabJobWork } from '../services/lab/lab-job-work';
import type { LabRunner } from '../services/lab/lab-queue';
import { decodePayload } from './job-payload';
import type { LabJobRunData } from './jobs';

const PROGRESS_WRITE_MS = 300;

/**
 * Carries out one lab job in a worker process: marks its row running, adds its steps to the lab
 * queue (any worker's threads take them), writes progress as they come and the result or the
 * error's message at the end. A job cancelled while it waited is not started; one cancelled while
 * it runs stops (its steps too) and leaves the row as the cancel wrote it. A job taken over after
 * its worker was lost starts again, finding the steps already done by their job ids.
 */
export function labJobProcessor(deps: { db: Knex; runner: LabRunner; logger: Logger }) {
  const { db, runner, logger } = deps;
  return async (job: Job<LabJobRunData>, _token?: string, signal?: AbortSignal): Promise<void> => {
    const { labJobId, organisationId } = job.data;
    const row = () => db('lab_jobs').where({ id: labJobId, organisation_id: organisationId });
    const log = logger.child({ jobId: job.id, labJobId, attempt: job.attemptsStarted });
    const started = await row().whereIn('status', ['queued', 'running']).update({ status: 'running' });
    if (!started) return;
    let lastWrite = 0;
    let pending: Promise<unknown> = Promise.resolve();
    const report = (fraction: number, message = '') => {
      const now = Date.now();
      if (now - lastWrite < PROGRESS_WRITE_MS) return;
      lastWrite = now;
      pending = row().where('status', 'running').update({ progress: Math.min(1, Math.max(0, fraction)), message: message.slice(0, 500) }).catch(() => undefined);
    };
    const work = decodePayload<LabJobWork>(job.data.work);
    try {
      const result = await performLabJob(work, { organisationId, labJobId, runner, signal: signal ?? new AbortController().signal, report });
      await pending;
      await row().where('status', 'running').update({ status: 'done', progress: 1, message: '', result: JSON.stringify(result), finished_at: db.fn.now() });
      log.info('lab job done');
    } catch (error) {
      await pending;
      if (signal?.aborted) throw new UnrecoverableError('Cancelled.');
      // A step failed for its input: the job fails once, with the step's message.
      const message = (error instanceof Error ? error.message : String(error)).slice(0, 2000) || 'The lab job failed without a message.';
      await row().where('status', 'running').update({ status: 'failed', error_message: message, finished_at: db.fn.now() });
      log.warn('lab job failed');
      throw new UnrecoverableError(message);
    }
  };
}
