import type { Job } from 'bullmq';
import { QUEUE_LABELS, type QueueStatus } from '../../shared/schemas/queue';
import type { TenantScope } from '../services/tenant-scope';
import type { JobQueues } from './job-queues';
import { QUEUE_NAMES, type QueueName } from './jobs';

/** Jobs read per state: the page is for watching, not an archive. */
const SCAN = 2000;
const HOUR_MS = 3600_000;

type AnyJob = Job<{ organisationId?: number; runId?: number; memberIndex?: number }>;

/**
 * The queue page of an organisation's admin: each queue's waiting, running, delayed, failed and
 * retried jobs of the organisation (other organisations' jobs are neither counted nor shown), and
 * the failed ones' messages.
 */
export async function queueStatus(queues: JobQueues, scope: TenantScope, organisationLimit: number): Promise<QueueStatus> {
  const health = await queues.health();
  if (health.redis === 'down') return { queues: [], failed: [], workers: 0, redis: 'down', organisationLimit };
  const own = (jobs: AnyJob[]) => jobs.filter((j) => j?.data?.organisationId === scope.organisationId);
  const counts = [];
  const failedJobs: { queue: QueueName; job: AnyJob }[] = [];
  for (const name of QUEUE_NAMES) {
    const queue = queues.queue(name);
    const read = async (states: ('waiting' | 'prioritized' | 'active' | 'delayed' | 'failed' | 'completed')[]) => own((await queue.getJobs(states, 0, SCAN - 1)) as AnyJob[]);
    const [waiting, active, delayed, failed, completed] = await Promise.all([
      read(['waiting', 'prioritized']), read(['active']), read(['delayed']), read(['failed']), read(['completed']),
    ]);
    const recent = completed.filter((j) => (j.finishedOn ?? 0) > Date.now() - HOUR_MS);
    counts.push({
      name, label: QUEUE_LABELS[name], waiting: waiting.length, active: active.length, delayed: delayed.length, failed: failed.length,
      retried: [...recent, ...failed, ...active].filter((j) => j.attemptsStarted > 1 || j.stalledCounter > 0).length,
      completedLastHour: recent.length,
    });
    failedJobs.push(...failed.map((job) => ({ queue: name, job })));
  }
  failedJobs.sort((a, b) => (b.job.finishedOn ?? 0) - (a.job.finishedOn ?? 0));
  const shown = failedJobs.slice(0, 50);
  const runIds = [...new Set(shown.flatMap(({ job }) => (job.data.runId ? [job.data.runId] : [])))];
  const runs: { id: number; scenario_name: string; simulation_count: number; catchment: string }[] = runIds.length
    ? await scope.from('runs').whereIn('runs.id', runIds).join('catchments', 'catchments.id', 'runs.catchment_id')
      .select('runs.id', 'runs.scenario_name', 'runs.simulation_count', 'catchments.name as catchment')
    : [];
  const byId = new Map(runs.map((r) => [r.id, r]));
  return {
    queues: counts,
    failed: shown.map(({ queue, job }) => {
      const run = job.data.runId ? byId.get(job.data.runId) : undefined;
      const label = run
        ? `Run ${run.id} (${run.scenario_name}, ${run.catchment}): simulation ${(job.data.memberIndex ?? 0) + 1} of ${run.simulation_count}`
        : queue === 'lab' ? 'Lab computation' : queue === 'lab-jobs' ? 'Lab sweep or calibration' : `Simulation of a removed run`;
      return { queue, jobId: job.id!, label, message: job.failedReason || 'Failed without a message.', attempts: job.attemptsMade, failedAt: job.finishedOn ? new Date(job.finishedOn).toISOString() : null };
    }),
    workers: health.workers,
    redis: 'up',
    organisationLimit,
  };
}
