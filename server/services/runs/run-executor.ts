import { setMaxListeners } from 'node:events';
import type { Knex } from 'knex';
import type { MemberPlan } from '../../../shared/analysis/run-plan';
import type { MemberInput, MemberSummary } from '../../../shared/analysis/simulate-summary';
import { settledWithin } from '../settled-within';
import { TenantScope } from '../tenant-scope';
import type { Simulator } from './simulator';
import { storeMembers } from './run-store';

/** A queued run with every member's complete engine input, held in memory until it finishes. */
export interface RunJob {
  runId: number;
  organisationId: number;
  members: { plan: MemberPlan; input: MemberInput }[];
}

/** How often progress is written to the run row while simulating. */
const PROGRESS_WRITE_MS = 300;
const RESTART_MESSAGE = 'The server restarted before this run finished; start it again.';
/** The abort reason of runs cut by a shutdown (a member's cancel aborts without one). */
const SHUTDOWN = new Error(RESTART_MESSAGE);

function failureMessage(error: unknown): string {
  const message = error instanceof Error ? error.message : String(error);
  return message.slice(0, 2000) || 'The run failed without a message.';
}

/**
 * Runs jobs in order, a few at a time, each job's simulations handed to the simulator (the worker pool).
 * Lifecycle of a run row: queued → running → done | failed | cancelled.
 */
export class RunExecutor {
  private readonly queue: RunJob[] = [];
  private readonly active = new Map<number, AbortController>();
  private readonly finished = new Set<Promise<void>>();

  constructor(
    private readonly db: Knex,
    private readonly simulator: Simulator,
    private readonly maxConcurrentRuns = 2,
  ) {}

  /** Marks runs left queued or running by an earlier process as failed (their inputs were in its memory). */
  async recover(): Promise<void> {
    await this.db('runs').whereIn('status', ['queued', 'running'])
      .update({ status: 'failed', error_message: RESTART_MESSAGE, finished_at: this.db.fn.now(3) });
  }

  enqueue(job: RunJob): void {
    this.queue.push(job);
    this.next();
  }

  /** Cancels a queued or running run; false when this process does not hold it. */
  async cancel(runId: number): Promise<boolean> {
    const queued = this.queue.findIndex((j) => j.runId === runId);
    if (queued >= 0) {
      this.queue.splice(queued, 1);
      await this.finish(runId, 'cancelled', null);
      return true;
    }
    const controller = this.active.get(runId);
    if (!controller) return false;
    controller.abort();
    return true;
  }

  /** Resolves when nothing is queued or running (tests). */
  async idle(): Promise<void> {
    while (this.finished.size > 0 || this.queue.length > 0) await Promise.all([...this.finished]);
  }

  /**
   * Shutdown within a deadline: waits up to `graceMs` for the runs in hand, then ends those still
   * queued or running as failed with the restart message (what `recover` would mark them at the
   * next start), so a long ensemble never holds the process up.
   */
  async stop(graceMs: number): Promise<void> {
    if (await settledWithin(this.idle(), graceMs)) return;
    for (const job of this.queue.splice(0)) await this.finish(job.runId, 'failed', RESTART_MESSAGE);
    for (const controller of this.active.values()) controller.abort(SHUTDOWN);
    await this.idle();
  }

  private next(): void {
    while (this.active.size < this.maxConcurrentRuns && this.queue.length > 0) {
      const job = this.queue.shift()!;
      const controller = new AbortController();
      // Every simulation of the job listens to the same signal.
      setMaxListeners(0, controller.signal);
      this.active.set(job.runId, controller);
      const done = this.execute(job, controller.signal).finally(() => {
        this.active.delete(job.runId);
        this.finished.delete(done);
        this.next();
      });
      this.finished.add(done);
    }
  }

  private async execute(job: RunJob, signal: AbortSignal): Promise<void> {
    const { runId } = job;
    await this.db('runs').where({ id: runId }).update({ status: 'running', started_at: this.db.fn.now(3), progress: 0 });
    const fractions = new Float64Array(job.members.length);
    let lastWrite = 0;
    const reportProgress = (i: number, fraction: number) => {
      fractions[i] = fraction;
      const now = Date.now();
      if (now - lastWrite < PROGRESS_WRITE_MS) return;
      lastWrite = now;
      const progress = fractions.reduce((a, b) => a + b, 0) / fractions.length;
      // Progress is advisory: a failed write must not fail the run.
      void this.db('runs').where({ id: runId, status: 'running' }).update({ progress: Math.min(progress, 0.99) }).catch(() => undefined);
    };
    try {
      const summaries = await this.simulateAll(job, reportProgress, signal);
      if (signal.aborted) throw signal.reason;
      await storeMembers(new TenantScope(this.db, job.organisationId), runId, job.members.map((m, i) => ({ plan: m.plan, summary: summaries[i] })));
      await this.finish(runId, 'done', null);
    } catch (error) {
      if (signal.aborted && signal.reason === SHUTDOWN) await this.finish(runId, 'failed', RESTART_MESSAGE);
      else if (signal.aborted) await this.finish(runId, 'cancelled', null);
      else await this.finish(runId, 'failed', failureMessage(error));
    }
  }

  /**
   * Hands the job's simulations to the pool a few at a time rather than all at once: copying
   * each input to a thread happens on the API's event loop, and 100 copies in one go would stall it.
   */
  private async simulateAll(job: RunJob, onProgress: (i: number, fraction: number) => void, signal: AbortSignal): Promise<MemberSummary[]> {
    const summaries = new Array<MemberSummary>(job.members.length);
    let next = 0;
    const lane = async () => {
      while (next < job.members.length && !signal.aborted) {
        const i = next++;
        summaries[i] = await this.simulator.simulate(job.members[i].input, (f) => onProgress(i, f), signal);
      }
    };
    await Promise.all(Array.from({ length: Math.min(job.members.length, this.simulator.threads * 2) }, lane));
    return summaries;
  }

  private async finish(runId: number, status: 'done' | 'failed' | 'cancelled', message: string | null): Promise<void> {
    await this.db('runs').where({ id: runId }).update({
      status, error_message: message, finished_at: this.db.fn.now(3), ...(status === 'done' ? { progress: 1 } : {}),
    });
  }
}
