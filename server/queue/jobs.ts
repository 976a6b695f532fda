import type { JobsOptions } from 'bullmq';

/**
 * The queues: `simulations` holds run members (single runs and study runs), `lab` the lab's
 * computations (curves a scientist waits for, sweep and calibration steps), `lab-jobs` the lab's
 * long jobs themselves (a sweep, a calibration), each carried out by a worker that adds its steps
 * to `lab` and keeps the job's row up to date. A worker process takes from all three; within a
 * queue a lower priority number goes first.
 */
export const QUEUE_NAMES = ['simulations', 'lab', 'lab-jobs'] as const;
export type QueueName = (typeof QUEUE_NAMES)[number];

/**
 * Priorities (BullMQ: 1 is served first). A run someone started on one catchment goes ahead of the
 * members of a regional study, so a single run never waits behind a study's hundreds of jobs; lab
 * panels a user waits for go ahead of the lab's sweeps and calibrations.
 */
export const PRIORITY = { interactive: 1, run: 2, batch: 5, study: 10 } as const;
export type JobPriority = keyof typeof PRIORITY;

/** One simulation of a run: which member of which run (its inputs are stored with the run). */
export interface MemberJobData {
  runId: number;
  organisationId: number;
  memberIndex: number;
}

/** One lab computation: the task as structured-clone bytes (job-payload.ts). */
export interface LabJobData {
  organisationId: number;
  task: string;
}

/** One lab job (its row in lab_jobs): what it does, as structured-clone bytes of a LabJobWork (services/lab/lab-job-work.ts). */
export interface LabJobRunData {
  organisationId: number;
  labJobId: number;
  work: string;
}

/** The queue job of a lab job: one per row, so it is never added twice. */
export const labJobQueueId = (labJobId: number) => `lab-job-${labJobId}`;

/** The job of a run's member: one id per member, so adding it again (recovery) never doubles it. */
export const memberJobId = (runId: number, memberIndex: number) => `run-${runId}-${memberIndex}`;

/**
 * Faults (a lost connection, a killed worker) are retried with a back-off; a job that fails for its
 * input is marked unrecoverable by its processor and fails once. Finished jobs are kept an hour and
 * failed ones a week for the queue page.
 */
export const JOB_OPTIONS: JobsOptions = {
  attempts: 5,
  backoff: { type: 'exponential', delay: 500 },
  removeOnComplete: { age: 3600, count: 5000 },
  removeOnFail: { age: 7 * 24 * 3600, count: 5000 },
};

/** Published when runs are cancelled: every worker stops its jobs of those runs. */
export const CANCEL_CHANNEL = 'cancel-runs';
/** Published when a lab computation is cancelled: the worker holding it stops it. */
export const CANCEL_LAB_CHANNEL = 'cancel-lab';
/** Published with a lab job's id when it is cancelled: the worker carrying it out stops it and its steps. */
export const CANCEL_LAB_JOB_CHANNEL = 'cancel-lab-job';
