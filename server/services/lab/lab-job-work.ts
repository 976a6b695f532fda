import { assembleSweep, type SweepPlan, type SweepSetup } from '../../../shared/lab/sweep';
import type { LabSite } from '../../../shared/lab/site';
import type { LabTask } from '../../workers/lab-worker';
import type { LabRunner } from './lab-queue';

/** How a job tells its progress: a share done (0 … 1) and a line for people. */
export type LabJobReport = (fraction: number, message?: string) => void;

/**
 * What a lab job does, as data (it travels in the job to whichever worker process runs it):
 * one computation (a calibration, a water-balance closure), or a sweep (the snowpack built once
 * before the period, then its cells in chunks spread over every worker's threads).
 */
export type LabJobWork =
  | { shape: 'single'; task: LabTask; progress: { kind: 'evaluations'; max: number } | { kind: 'text'; text: string } }
  | { shape: 'sweep'; site: LabSite; plan: SweepPlan; chunks: number[][][] };

export interface LabJobContext {
  organisationId: number;
  labJobId: number;
  runner: LabRunner;
  signal: AbortSignal;
  report: LabJobReport;
}

/** Carries out a lab job's work through the lab queue and returns its result. */
export async function performLabJob(work: LabJobWork, context: LabJobContext): Promise<unknown> {
  const { organisationId, labJobId, runner, signal, report } = context;
  if (work.shape === 'single') {
    const message = (fraction: number) => (work.progress.kind === 'evaluations'
      ? `${Math.round(fraction * work.progress.max)} of at most ${work.progress.max} model runs`
      : work.progress.text);
    return runner.run(work.task, { onProgress: (f) => report(f, message(f)), signal, priority: 'batch', organisationId });
  }
  const { site, plan, chunks } = work;
  const cellCount = chunks.reduce((n, c) => n + c.length, 0);
  report(0, 'Building the snowpack before the period');
  const { setup, baseline } = await runner.run<{ setup: SweepSetup; baseline: number }>(
    { kind: 'sweepSetup', site, plan }, { signal, priority: 'batch', organisationId, jobId: `lab-job-${labJobId}-setup` },
  );
  const done = new Array<number>(chunks.length).fill(0);
  const onCells = (k: number) => (fraction: number) => {
    done[k] = fraction * chunks[k].length;
    const total = done.reduce((s, v) => s + v, 0);
    report(total / cellCount, `${Math.round(total)} of ${cellCount} runs`);
  };
  // Each chunk keeps its job id, so a job taken over after a worker was lost finds the chunks already done.
  const parts = await Promise.all(chunks.map((chunk, k) => runner.run<number[]>(
    { kind: 'sweepCells', setup, cells: chunk }, { onProgress: onCells(k), signal, priority: 'batch', organisationId, jobId: `lab-job-${labJobId}-cells-${k}` },
  )));
  return assembleSweep(plan, baseline, parts.flat());
}
