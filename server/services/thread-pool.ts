import type { MessagePort } from 'node:worker_threads';
import { MessageChannel } from 'node:worker_threads';
import { Piscina } from 'piscina';
import type { TaskPriority, ThreadBudget } from './thread-budget';
import { bundledWorker } from './worker-bundle';

/** What a pooled worker receives: its task and a port for progress fractions (0 … 1). */
export interface PooledTask<T> {
  task: T;
  progress: MessagePort;
}

export interface RunOptions {
  onProgress?: (fraction: number) => void;
  /** Aborting rejects with an AbortError and stops the worker (or leaves the queue). */
  signal?: AbortSignal;
  /** Overrides the pool's own priority for this task. */
  priority?: TaskPriority;
}

const TSX_LOADER = /tsx/;

/**
 * A piscina pool of TypeScript workers, so heavy work never blocks the API's event loop. Every
 * pool draws from the one ThreadBudget: a task runs only while it holds one of the budget's
 * threads. Threads start on the first task (or at `warm`) and stop after a minute idle. When this
 * process was not started by tsx (e.g. under Vitest), the threads get tsx's loader themselves.
 */
export class ThreadPool<TTask, TResult> {
  private piscina: Piscina | null = null;
  private warmed = false;

  constructor(
    private readonly worker: URL,
    /** The budget this pool draws from, shared with every other pool of the context. */
    readonly budget: ThreadBudget,
    private readonly priority: TaskPriority,
    /** Run the worker as one bundled file (engine work: see worker-bundle.ts); only for workers that read no files beside their sources. */
    private readonly bundle = false,
  ) {}

  /** Threads this pool may use at once: the whole budget, shared with the other pools. */
  get threads(): number {
    return this.budget.threads;
  }

  /** Starts a thread now and keeps one (loading the engine or the PDF fonts in a thread takes a moment). */
  warm(): void {
    this.warmed = true;
    void this.pool;
  }

  private get pool(): Piscina {
    const execArgv = process.execArgv.some((a) => TSX_LOADER.test(a)) ? process.execArgv : [...process.execArgv, '--import', 'tsx'];
    this.piscina ??= new Piscina({
      filename: (this.bundle ? bundledWorker(this.worker) : this.worker).href, minThreads: this.warmed ? 1 : 0, maxThreads: this.budget.threads, idleTimeout: 60_000, execArgv,
    });
    return this.piscina;
  }

  /** Runs one task in a worker once the budget has a thread for it. */
  async run<R = TResult>(task: TTask, options: RunOptions = {}): Promise<R> {
    return this.budget.use(options.priority ?? this.priority, async () => {
      const { port1, port2 } = new MessageChannel();
      if (options.onProgress) port1.on('message', options.onProgress);
      try {
        const message: PooledTask<TTask> = { task, progress: port2 };
        return (await this.pool.run(message, { transferList: [port2], signal: options.signal })) as R;
      } finally {
        port1.close();
      }
    }, options.signal);
  }

  async close(): Promise<void> {
    await this.piscina?.close({ force: true });
    this.piscina = null;
  }
}
