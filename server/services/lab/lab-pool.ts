import { availableParallelism } from 'node:os';
import type { LabTask } from '../../workers/lab-worker';
import { ThreadPool } from '../thread-pool';

/** Threads for lab work: one less than the machine's cores (the API keeps one), at least one. */
export function defaultLabThreads(): number {
  return Math.max(1, Math.min(4, availableParallelism() - 1));
}

/** Worker threads for the lab's computations (server/workers/lab-worker.ts). */
export class LabPool extends ThreadPool<LabTask, unknown> {
  constructor(threads = defaultLabThreads()) {
    super(new URL('../../workers/lab-worker.ts', import.meta.url), threads);
  }
}
