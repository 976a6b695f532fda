import type { Knex } from 'knex';
import type { LabJob } from '../../../shared/schemas/lab';
import { conflict } from '../../errors';
import { encodePayload } from '../../queue/job-payload';
import type { JobQueues } from '../../queue/job-queues';
import { CANCEL_LAB_JOB_CHANNEL, labJobQueueId, type LabJobRunData } from '../../queue/jobs';
import type { UserRow } from '../auth/auth-service';
import type { TenantScope } from '../tenant-scope';
import type { LabJobWork } from './lab-job-work';

interface JobRow {
  id: number;
  organisation_id: number;
  catchment_id: number;
  kind: LabJob['kind'];
  status: LabJob['status'];
  progress: number;
  message: string;
  result: string | null | unknown;
  error_message: string | null;
  created_by_name: string;
  created_at: Date;
  finished_at: Date | null;
}

const LOST_MESSAGE = 'This job was lost by the job queue before it finished; start it again.';
const CANCELLED_MESSAGE = 'Cancelled by a member of the organisation.';

/**
 * A fault (a worker lost mid-job) is retried by another worker, which finds the steps already
 * done; a job that fails for its input fails once (its processor says so). A finished job stays
 * an hour for the queue page's count (at most 200: its inputs can be large, and its row keeps the
 * result); failed ones stay a week.
 */
const LAB_JOB_OPTIONS = { attempts: 3, backoff: { type: 'fixed', delay: 1000 }, removeOnComplete: { age: 3600, count: 200 }, removeOnFail: { age: 7 * 24 * 3600, count: 1000 } } as const;

function toJob(row: JobRow): LabJob {
  return {
    id: row.id,
    catchmentId: row.catchment_id,
    kind: row.kind,
    status: row.status,
    progress: row.progress,
    message: row.message,
    error: row.error_message,
    result: typeof row.result === 'string' ? JSON.parse(row.result) : (row.result ?? null),
    createdBy: row.created_by_name,
    createdAt: new Date(row.created_at).toISOString(),
    finishedAt: row.finished_at ? new Date(row.finished_at).toISOString() : null,
  };
}

/**
 * Lab jobs (sweeps, calibrations, water-balance closures): a row per job holds its status,
 * progress and result for polling; the work itself is a job on the `lab-jobs` queue, carried out
 * by a worker process (server/queue/lab-job-processor.ts), so neither a restart of the API nor
 * the loss of one worker ends it. Lifecycle: queued → running → done | failed | cancelled.
 */
export class LabJobs {
  constructor(
    private readonly db: Knex,
    private readonly queues: JobQueues,
  ) {}

  /**
   * At server start: rows left open whose job the queue no longer has (Redis lost its data) end
   * failed with a message. A row of the last minute is left alone: another API process may be
   * adding its job at this moment.
   */
  async recover(): Promise<void> {
    const open: { id: number }[] = await this.db('lab_jobs').whereIn('status', ['queued', 'running'])
      .where('created_at', '<', new Date(Date.now() - 60_000)).select('id');
    for (const { id } of open) {
      if (await this.queues.labJobs.getJob(labJobQueueId(id))) continue;
      await this.db('lab_jobs').where('id', id).whereIn('status', ['queued', 'running']).update({ status: 'failed', error_message: LOST_MESSAGE, finished_at: this.db.fn.now() });
    }
  }

  async start(scope: TenantScope, user: UserRow, catchmentId: number, kind: LabJob['kind'], request: unknown, work: LabJobWork): Promise<LabJob> {
    const id = await scope.insert('lab_jobs', {
      catchment_id: catchmentId, kind, status: 'queued', request: JSON.stringify(request), created_by: user.id, created_by_name: user.name,
    });
    const data: LabJobRunData = { organisationId: scope.organisationId, labJobId: id, work: encodePayload(work) };
    await this.queues.labJobs.add('lab-job', data, { ...LAB_JOB_OPTIONS, jobId: labJobQueueId(id) });
    return this.get(scope, id);
  }

  async get(scope: TenantScope, id: number): Promise<LabJob> {
    return toJob(await scope.findOr404<JobRow>('lab_jobs', id, 'Lab job'));
  }

  async list(scope: TenantScope, catchmentId: number): Promise<LabJob[]> {
    const rows: JobRow[] = await scope.from<JobRow>('lab_jobs').where('catchment_id', catchmentId).orderBy('id', 'desc').limit(20);
    return rows.map((r) => ({ ...toJob(r), result: null }));
  }

  /** Ends the job as cancelled: a job still waiting leaves the queue, the worker carrying one out stops it and its steps. */
  async cancel(scope: TenantScope, id: number): Promise<LabJob> {
    const job = await this.get(scope, id);
    if (job.status !== 'running' && job.status !== 'queued') {
      throw conflict(`This job has already ${job.status === 'done' ? 'finished' : job.status === 'failed' ? 'failed' : 'been cancelled'}.`);
    }
    await scope.from('lab_jobs').where('id', id).whereIn('status', ['queued', 'running'])
      .update({ status: 'cancelled', error_message: CANCELLED_MESSAGE, finished_at: scope.db.fn.now() });
    // A job a worker holds is locked and stays; that worker hears the cancel.
    await this.queues.labJobs.remove(labJobQueueId(id)).catch(() => undefined);
    await this.queues.publish(CANCEL_LAB_JOB_CHANNEL, String(id));
    return this.get(scope, id);
  }
}
