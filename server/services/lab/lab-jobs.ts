import type { Knex } from 'knex';
import type { LabJob } from '../../../shared/schemas/lab';
import { conflict } from '../../errors';
import type { UserRow } from '../auth/auth-service';
import { BackgroundWork } from '../background-work';
import type { TenantScope } from '../tenant-scope';

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

/** What a job does: gets a signal that aborts on cancel and a progress reporter (0 … 1, message). */
export type JobWork = (signal: AbortSignal, report: (fraction: number, message?: string) => void) => Promise<unknown>;

const PROGRESS_WRITE_MS = 300;
const RESTART_MESSAGE = 'The server restarted before this job finished; start it again.';
/** The abort reason of jobs cut by a shutdown (a member's cancel gives another). */
const SHUTDOWN = new Error(RESTART_MESSAGE);

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
 * Lab jobs (sweeps, automatic calibrations): a row per job holds its status and progress for
 * polling; the work runs in this process (on the lab's worker pool) and can be cancelled.
 * Lifecycle: running → done | failed | cancelled.
 */
export class LabJobs {
  private readonly work = new BackgroundWork<number>();

  constructor(private readonly db: Knex) {}

  /** Marks jobs an earlier process left running as failed. */
  async recover(): Promise<void> {
    await this.db('lab_jobs').whereIn('status', ['queued', 'running']).update({ status: 'failed', error_message: RESTART_MESSAGE, finished_at: this.db.fn.now() });
  }

  async start(scope: TenantScope, user: UserRow, catchmentId: number, kind: LabJob['kind'], request: unknown, work: JobWork): Promise<LabJob> {
    const id = await scope.insert('lab_jobs', {
      catchment_id: catchmentId, kind, status: 'running', request: JSON.stringify(request), created_by: user.id, created_by_name: user.name,
    });
    this.work.run(id, (signal) => this.execute(id, work, signal));
    return this.get(scope, id);
  }

  async get(scope: TenantScope, id: number): Promise<LabJob> {
    return toJob(await scope.findOr404<JobRow>('lab_jobs', id, 'Lab job'));
  }

  async list(scope: TenantScope, catchmentId: number): Promise<LabJob[]> {
    const rows: JobRow[] = await scope.from<JobRow>('lab_jobs').where('catchment_id', catchmentId).orderBy('id', 'desc').limit(20);
    return rows.map((r) => ({ ...toJob(r), result: null }));
  }

  async cancel(scope: TenantScope, id: number): Promise<LabJob> {
    const job = await this.get(scope, id);
    if (job.status !== 'running') throw conflict(`This job has already ${job.status === 'done' ? 'finished' : job.status === 'failed' ? 'failed' : 'been cancelled'}.`);
    if (!(await this.work.abort(id, new Error('Cancelled.')))) {
      // Running in a process that no longer holds it (e.g. another server instance that stopped): just close the row.
      await scope.from('lab_jobs').where('id', id).update({ status: 'cancelled', error_message: 'Cancelled by a member of the organisation.', finished_at: scope.db.fn.now() });
    }
    return this.get(scope, id);
  }

  /** Resolves when no job is running (tests). */
  async idle(): Promise<void> {
    await this.work.idle();
  }

  /** Shutdown within a deadline: waits up to `graceMs` for the jobs running, then ends the rest as failed with the restart message. */
  async stop(graceMs: number): Promise<void> {
    await this.work.stop(graceMs, SHUTDOWN);
  }

  private async execute(id: number, work: JobWork, signal: AbortSignal): Promise<void> {
    let lastWrite = 0;
    let pending: Promise<unknown> = Promise.resolve();
    const report = (fraction: number, message = '') => {
      const now = Date.now();
      if (now - lastWrite < PROGRESS_WRITE_MS) return;
      lastWrite = now;
      pending = this.db('lab_jobs').where({ id, status: 'running' }).update({ progress: Math.min(1, Math.max(0, fraction)), message: message.slice(0, 500) });
    };
    try {
      const result = await work(signal, report);
      await pending;
      await this.db('lab_jobs').where('id', id).update({ status: 'done', progress: 1, message: '', result: JSON.stringify(result), finished_at: this.db.fn.now() });
    } catch (error) {
      await pending.catch(() => undefined);
      const cancelled = signal.aborted && signal.reason !== SHUTDOWN;
      const message = cancelled ? 'Cancelled by a member of the organisation.'
        : signal.aborted ? RESTART_MESSAGE : (error instanceof Error ? error.message : String(error)).slice(0, 2000);
      await this.db('lab_jobs').where('id', id).update({ status: cancelled ? 'cancelled' : 'failed', error_message: message, finished_at: this.db.fn.now() });
    }
  }
}

