import { availableParallelism } from 'node:os';
import { MessageChannel } from 'node:worker_threads';
import { Piscina } from 'piscina';
import type { LabTask, LabTaskMessage } from '../../workers/lab-worker';

const WORKER = new URL('../../workers/lab-worker.ts', import.meta.url);
const TSX_LOADER = /tsx/;

/** Threads for lab work: one less than the machine's cores (the API keeps one), at least one. */
export function defaultLabThreads(): number {
  return Math.max(1, Math.min(4, availableParallelism() - 1));
}

/**
 * Worker threads for the lab's computations (same pattern as the run pool: piscina, TypeScript
 * workers given tsx's loader when this process was not started by tsx).
 */
export class LabPool {
  private piscina: Piscina | null = null;

  constructor(readonly threads = defaultLabThreads()) {}

  /** Starts the threads now rather than on the first task: loading the engine in a thread stalls the API briefly. */
  warm(): void {
    void this.pool;
  }

  private get pool(): Piscina {
    const execArgv = process.execArgv.some((a) => TSX_LOADER.test(a)) ? process.execArgv : [...process.execArgv, '--import', 'tsx'];
    this.piscina ??= new Piscina({ filename: WORKER.href, minThreads: this.threads, maxThreads: this.threads, idleTimeout: 60_000, execArgv });
    return this.piscina;
  }

  /** Runs one task in a worker; rejects with an AbortError when `signal` aborts (the worker is stopped). */
  async run<T>(task: LabTask, onProgress: (fraction: number) => void = () => {}, signal?: AbortSignal): Promise<T> {
    const { port1, port2 } = new MessageChannel();
    port1.on('message', (fraction: number) => onProgress(fraction));
    try {
      const message: LabTaskMessage = { task, progress: port2 };
      return (await this.pool.run(message, { transferList: [port2], signal })) as T;
    } finally {
      port1.close();
    }
  }

  async close(): Promise<void> {
    await this.piscina?.close({ force: true });
    this.piscina = null;
  }
}
