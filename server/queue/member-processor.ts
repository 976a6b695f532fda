import { DelayedError, UnrecoverableError, type Job } from 'bullmq';
import type { Knex } from 'knex';
import type { Logger } from '../logger';
import type { SimulationPool } from '../services/runs/simulation-pool';
import { memberInput } from '../services/runs/run-inputs';
import { storeMember, type MemberStored } from '../services/runs/run-store';
import { TenantScope } from '../services/tenant-scope';
import type { MemberJobData } from './jobs';
import type { OrganisationSlots } from './organisation-slots';
import type { RunInputsCache } from './run-inputs-cache';
import type { RunProgress } from './run-progress';

export interface MemberProcessorDeps {
  db: Knex;
  pool: SimulationPool;
  slots: OrganisationSlots;
  inputs: RunInputsCache;
  logger: Logger;
  /** Members' fractions done, shared by every worker (see run-progress.ts). */
  progress: RunProgress;
  /** How long a job waits before trying again when its organisation is at its limit. */
  retryDelayMs?: number;
  /** Called with the run id while a job of it is held (the cancel listener stops them by run). */
  holding: { add(runId: number, jobId: string): void; remove(runId: number, jobId: string): void };
}

export type MemberOutcome = MemberStored | { outcome: 'skipped'; finished: false };

const PROGRESS_WRITE_MS = 500;

export function messageOf(error: unknown): string {
  const message = error instanceof Error ? error.message : String(error);
  return message.slice(0, 2000) || 'The simulation failed without a message.';
}

/** Marks a run failed with the message the user sees, unless it has already ended. */
export async function failRun(db: Knex, runId: number, message: string): Promise<boolean> {
  const changed = await db('runs').where('id', runId).whereIn('status', ['queued', 'running'])
    .update({ status: 'failed', error_message: message, finished_at: db.fn.now(3) });
  return changed > 0;
}

/**
 * Simulates one member of a run and stores it. A member of a run no longer queued or running, or
 * one stored already (a retry after a fault), is skipped; an organisation at its limit sends the
 * job back to wait; an engine error is the input's fault and fails the run once, with its message
 * (UnrecoverableError: not retried); anything else (a lost connection) is retried by the queue.
 */
export function memberProcessor(deps: MemberProcessorDeps) {
  const { db, pool, slots, inputs, progress, logger } = deps;
  return async (job: Job<MemberJobData>, token?: string, signal?: AbortSignal): Promise<MemberOutcome> => {
    const { runId, organisationId, memberIndex } = job.data;
    const jobId = job.id!;
    const log = logger.child({ jobId, runId, memberIndex, attempt: job.attemptsStarted });
    // A one-member run's share is its member's fraction; a longer run's counts every member's, stored or simulating.
    let memberCount = 1;
    const runShare = (fraction: number) => (memberCount === 1 ? Promise.resolve(fraction) : progress.report(runId, memberIndex, fraction, memberCount));
    // What the job needs is read side by side: the run's state, a slot of its organisation, its inputs (cached per run).
    const [run, slot] = await Promise.all([
      db('runs').where({ id: runId, organisation_id: organisationId }).first('status', 'simulation_count'),
      slots.take(organisationId, jobId),
    ]);
    if (!run || (run.status !== 'queued' && run.status !== 'running')) {
      if (slot) await slots.release(organisationId, jobId);
      return { outcome: 'skipped', finished: false };
    }
    memberCount = run.simulation_count;
    if (!slot) {
      await job.moveToDelayed(Date.now() + (deps.retryDelayMs ?? 200) * (1 + Math.random()), token);
      throw new DelayedError();
    }
    // The slot is renewed while the job runs, so a worker that dies frees it soon after.
    const renew = setInterval(() => void slots.take(organisationId, jobId).catch(() => undefined), 2000);
    deps.holding.add(runId, jobId);
    try {
      const stored = await inputs.get(runId, organisationId);
      if (!stored) return { outcome: 'skipped', finished: false };
      const plan = stored.plans[memberIndex];
      const scope = new TenantScope(db, organisationId);
      // A retry after a fault finds its member stored: counted, not simulated again.
      if (job.attemptsStarted > 1 && await scope.from('run_members').where({ run_id: runId, member_key: plan.key }).first('id')) {
        log.info('member already stored');
        return await storeMember(scope, runId, plan, null);
      }
      if (run.status === 'queued') await db('runs').where({ id: runId, status: 'queued' }).update({ status: 'running', started_at: db.fn.now(3) });
      // A member done within the first interval (most season runs) writes no progress of its own: storing it moves the run.
      let lastWrite = Date.now();
      const onProgress = (fraction: number) => {
        if (Date.now() - lastWrite < PROGRESS_WRITE_MS) return;
        lastWrite = Date.now();
        void runShare(fraction)
          .then((share) => db('runs').where({ id: runId, status: 'running' }).update({ progress: db.raw('GREATEST(progress, ?)', [Math.min(share, 0.99)]) }))
          .catch(() => undefined);
      };
      let summary;
      try {
        summary = await pool.simulate(memberInput(stored, memberIndex), onProgress, signal);
      } catch (error) {
        if (signal?.aborted) throw new UnrecoverableError('The run was cancelled.');
        log.warn('simulation failed for its input');
        throw new UnrecoverableError(messageOf(error));
      }
      const outcome = await storeMember(scope, runId, plan, summary);
      if (memberCount > 1) void (outcome.finished ? progress.forget(runId) : runShare(1)).catch(() => undefined);
      log.info({ outcome: outcome.outcome, finished: outcome.finished }, 'member stored');
      return outcome;
    } finally {
      clearInterval(renew);
      deps.holding.remove(runId, jobId);
      await slots.release(organisationId, jobId).catch(() => undefined);
    }
  };
}
