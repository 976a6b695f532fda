import { z } from 'zod';

export const QUEUE_LABELS = { simulations: 'Run simulations', lab: 'Lab computations', 'lab-jobs': 'Lab sweeps and calibrations' } as const;
const queueName = z.enum(['simulations', 'lab', 'lab-jobs']);

/** One queue as an organisation's admin sees it: only the organisation's own jobs are counted. */
export const queueCountsSchema = z.object({
  name: queueName,
  label: z.string(),
  waiting: z.number().int(),
  active: z.number().int(),
  /** Waiting for a fault back-off or for the organisation's limit to leave room. */
  delayed: z.number().int(),
  failed: z.number().int(),
  /** Jobs of the last hour that needed more than one attempt (a worker lost, a connection dropped). */
  retried: z.number().int(),
  completedLastHour: z.number().int(),
});

export const failedJobSchema = z.object({
  queue: queueName,
  jobId: z.string(),
  /** What the job was, in plain words ("Run 12 of Upper Vell: simulation 3 of 52"). */
  label: z.string(),
  message: z.string(),
  attempts: z.number().int(),
  failedAt: z.string().nullable(),
});

export const queueStatusSchema = z.object({
  queues: z.array(queueCountsSchema),
  failed: z.array(failedJobSchema),
  /** Worker processes connected now (for the whole installation). */
  workers: z.number().int(),
  redis: z.enum(['up', 'down']),
  /** Simulations one organisation may have running at once (ORGANISATION_CONCURRENCY). */
  organisationLimit: z.number().int(),
});
export type QueueStatus = z.infer<typeof queueStatusSchema>;
export const queueStatusReplySchema = z.object({ status: queueStatusSchema });
