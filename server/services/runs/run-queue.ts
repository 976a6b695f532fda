import type { Knex } from 'knex';
import type { JobQueues } from '../../queue/job-queues';
import { CANCEL_CHANNEL, type JobPriority } from '../../queue/jobs';
import { addMemberJobs, removeIdleMemberJobs } from '../../queue/member-jobs';

/**
 * The runs' side of the job queue in the API: every member of a run becomes a job on the
 * simulations queue, which worker processes (server/worker.ts) take, simulate and store. The
 * API only adds, removes and cancels jobs; it never simulates.
 */
export class RunQueue {
  constructor(private readonly db: Knex, private readonly queues: JobQueues) {}

  /** Queues every member of a run whose row and inputs are stored. */
  async enqueue(run: { runId: number; organisationId: number; memberCount: number; priority: JobPriority }): Promise<void> {
    await addMemberJobs(this.queues.simulations, run);
  }

  /**
   * Stops runs already marked cancelled (or failed): their waiting jobs leave the queue and the
   * workers holding their other jobs stop them.
   */
  async stop(runs: { runId: number; memberCount: number }[]): Promise<void> {
    if (runs.length === 0) return;
    await this.queues.publish(CANCEL_CHANNEL, JSON.stringify(runs.map((r) => r.runId)));
    for (const run of runs) await removeIdleMemberJobs(this.queues.simulations, run.runId, run.memberCount);
  }

  /**
   * Adds the jobs of runs still queued or running again (at server start): a job that was lost
   * before it reached Redis is queued, one that exists is left alone, and a member already stored
   * is found stored by the worker and not simulated twice.
   */
  async recover(): Promise<void> {
    const open = await this.db('runs').whereIn('status', ['queued', 'running'])
      .select('id', 'organisation_id', 'simulation_count')
      .select(this.db.raw('EXISTS (SELECT 1 FROM study_runs WHERE study_runs.run_id = runs.id) AS in_study'));
    for (const run of open) {
      await this.enqueue({ runId: run.id, organisationId: run.organisation_id, memberCount: run.simulation_count, priority: run.in_study ? 'study' : 'run' });
    }
  }
}
