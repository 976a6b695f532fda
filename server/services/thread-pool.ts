import type { MessagePort } from 'node:worker_threads';
import { MessageChannel } from 'node:worker_threads';
import { Piscina } from 'piscina';

/** What a pooled worker receives: its task and a port for progress fractions (0 … 1). */
export interface PooledTask<T> {
  task: T;
  progress: MessagePort;
}

const TSX_LOADER = /tsx/;

/**
 * A piscina pool of TypeScript workers, so heavy work never blocks the API's event loop. When
 * this process was not started by tsx (e.g. under Vitest), the threads get tsx's loader themselves.
 */
export class ThreadPool<TTask, TResult> {
  private piscina: Piscina | null = null;

  constructor(
    private readonly worker: URL,
    readonly threads: number,
  ) {}

  /** Starts the threads now rather than on the first task (loading the engine in a thread takes a moment). */
  warm(): void {
    void this.pool;
  }

  private get pool(): Piscina {
    const execArgv = process.execArgv.some((a) => TSX_LOADER.test(a)) ? process.execArgv : [...process.execArgv, '--import', 'tsx'];
    this.piscina ??= new Piscina({ filename: this.worker.href, minThreads: this.threads, maxThreads: this.threads, idleTimeout: 60_000, execArgv });
    return this.piscina;
  }

  /** Runs one task in a worker; rejects with an AbortError when `signal` aborts (the worker is stopped). */
  async run<R = TResult>(task: TTask, onProgress: (fraction: number) => void = () => {}, signal?: AbortSignal): Promise<R> {
    const { port1, port2 } = new MessageChannel();
    port1.on('message', (fraction: number) => onProgress(fraction));
    try {
      const message: PooledTask<TTask> = { task, progress: port2 };
      return (await this.pool.run(message, { transferList: [port2], signal })) as R;
    } finally {
      port1.close();
    }
  }

  async close(): Promise<void> {
    await this.piscina?.close({ force: true });
    this.piscina = null;
  }
}
