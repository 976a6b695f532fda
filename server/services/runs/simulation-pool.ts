import { MessageChannel } from 'node:worker_threads';
import { Piscina } from 'piscina';
import type { SimulationSummary } from '../../../shared/analysis/simulation-summary';
import type { SimulateTask } from '../../workers/simulate-worker';
import type { MemberInput } from '../../../shared/analysis/simulate-summary';

const WORKER = new URL('../../workers/simulate-worker.ts', import.meta.url);
const TSX_LOADER = /tsx/;

/**
 * Worker threads that run the melt engine, so simulations never block the API's event loop.
 * The worker is TypeScript: when this process was not started by tsx (e.g. under Vitest), the
 * threads get tsx's loader themselves.
 */
export class SimulationPool {
  private piscina: Piscina | null = null;

  constructor(readonly threads: number) {}

  /** Starts the threads now rather than on the first simulation (they take a moment to load the engine). */
  warm(): void {
    void this.pool;
  }

  private get pool(): Piscina {
    const execArgv = process.execArgv.some((a) => TSX_LOADER.test(a)) ? process.execArgv : [...process.execArgv, '--import', 'tsx'];
    this.piscina ??= new Piscina({ filename: WORKER.href, minThreads: this.threads, maxThreads: this.threads, idleTimeout: 60_000, execArgv });
    return this.piscina;
  }

  /** Simulates one engine input; rejects with an AbortError when `signal` aborts. */
  async simulate(input: MemberInput, onProgress: (fraction: number) => void, signal?: AbortSignal): Promise<SimulationSummary> {
    const { port1, port2 } = new MessageChannel();
    port1.on('message', (fraction: number) => onProgress(fraction));
    try {
      const task: SimulateTask = { input, progress: port2 };
      return (await this.pool.run(task, { transferList: [port2], signal })) as SimulationSummary;
    } finally {
      port1.close();
    }
  }

  async close(): Promise<void> {
    await this.piscina?.close({ force: true });
    this.piscina = null;
  }
}
