import type { CellStatus } from '../schemas/studies';

/** A cell of a study: one catchment × scenario template, with its run's state. */
export interface StudyCell {
  status: CellStatus;
  progress: number;
  message: string | null;
}

/** The state of a run as a study cell shows it (a queued run is waiting). */
export function cellStatusOf(runStatus: string | null, message: string | null): CellStatus {
  if (runStatus === null) return message ? 'failed' : 'waiting';
  if (runStatus === 'queued') return 'waiting';
  return runStatus as CellStatus;
}

const ORDER: CellStatus[] = ['failed', 'running', 'waiting', 'cancelled', 'done'];

/**
 * Where a catchment stands: failed as soon as one of its runs failed (with that run's message), else
 * running, waiting, cancelled, and done only when every run is done.
 */
export function catchmentStatus(cells: readonly StudyCell[]): { status: CellStatus; message: string | null; progress: number } {
  const status = ORDER.find((s) => cells.some((c) => c.status === s)) ?? 'waiting';
  const message = cells.find((c) => c.status === 'failed')?.message ?? null;
  const progress = cells.length ? cells.reduce((a, c) => a + (c.status === 'done' ? 1 : c.progress), 0) / cells.length : 0;
  return { status, message, progress };
}

/** A study's state from its catchments' (draft until started). */
export function studyStatus(started: boolean, catchments: readonly CellStatus[]): 'draft' | 'waiting' | 'running' | 'done' | 'failed' | 'cancelled' {
  if (!started) return 'draft';
  const open = catchments.some((s) => s === 'running' || s === 'waiting');
  if (open) return catchments.some((s) => s !== 'waiting') ? 'running' : 'waiting';
  if (catchments.some((s) => s === 'failed')) return 'failed';
  if (catchments.some((s) => s === 'cancelled')) return 'cancelled';
  return 'done';
}
