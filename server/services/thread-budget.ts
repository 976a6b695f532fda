import { availableParallelism } from 'node:os';

/** Work someone is waiting for (a PDF, a lab curve) goes before background work (run members, sweep cells). */
export type TaskPriority = 'interactive' | 'batch';

interface Waiter {
  grant(): void;
}

/**
 * The worker threads every pool shares: at most `threads` tasks run at once across the run, lab
 * and PDF pools, so heavy work never takes the core kept for the API. A task waits for a free
 * thread in order of arrival, interactive tasks before batch tasks; an aborted wait leaves the queue.
 */
export class ThreadBudget {
  private running = 0;
  private readonly waiting: Record<TaskPriority, Waiter[]> = { interactive: [], batch: [] };

  constructor(readonly threads: number) {
    if (!Number.isInteger(threads) || threads < 1) throw new RangeError(`ThreadBudget: threads must be a whole number ≥ 1, got ${threads}`);
  }

  /** Tasks running now (at most `threads`). */
  get busy(): number {
    return this.running;
  }

  /** Runs `work` once a thread is free; rejects with the signal's reason if it aborts while waiting. */
  async use<T>(priority: TaskPriority, work: () => Promise<T>, signal?: AbortSignal): Promise<T> {
    await this.acquire(priority, signal);
    try {
      return await work();
    } finally {
      this.release();
    }
  }

  private acquire(priority: TaskPriority, signal?: AbortSignal): Promise<void> {
    if (signal?.aborted) return Promise.reject(signal.reason);
    if (this.running < this.threads) {
      this.running += 1;
      return Promise.resolve();
    }
    return new Promise((resolve, reject) => {
      const queue = this.waiting[priority];
      const onAbort = () => {
        queue.splice(queue.indexOf(waiter), 1);
        reject(signal!.reason);
      };
      const waiter: Waiter = {
        grant: () => {
          signal?.removeEventListener('abort', onAbort);
          resolve();
        },
      };
      queue.push(waiter);
      signal?.addEventListener('abort', onAbort, { once: true });
    });
  }

  private release(): void {
    // The thread passes straight to the next waiter, so `running` stays the same.
    const next = this.waiting.interactive.shift() ?? this.waiting.batch.shift();
    if (next) next.grant();
    else this.running -= 1;
  }
}

/** The default budget: one thread fewer than the machine's cores (the API keeps one), at least one. */
export function defaultThreadCount(): number {
  return Math.max(1, availableParallelism() - 1);
}
