import { spawn, type ChildProcess } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import type { JobQueues } from './job-queues';

const WORKER_ENTRY = fileURLToPath(new URL('../worker.ts', import.meta.url));

export interface WorkerProcess {
  readonly child: ChildProcess;
  /** Resolves when the worker has connected to the queue and takes jobs. */
  readonly ready: Promise<void>;
  /** SIGTERM, and waits until it has exited (its jobs in hand finish or go back to the queue). */
  stop(): Promise<void>;
}

/**
 * Starts a worker process (`npm run worker`) beside this one, with this process's environment and
 * `env` over it: `npm start`, the demo seed, the tests and the queue benchmark use real worker
 * processes, the same that run on other machines in production.
 */
export function spawnWorker(env: Record<string, string | undefined> = {}, options: { output?: 'inherit' | 'ignore' } = {}): WorkerProcess {
  const child = spawn(process.execPath, ['--import', 'tsx', WORKER_ENTRY], {
    env: { ...process.env, ...env },
    stdio: ['ignore', options.output ?? 'inherit', options.output ?? 'inherit', 'ipc'],
  });
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  const ready = new Promise<void>((resolve, reject) => {
    child.once('message', (message) => {
      if (message === 'ready') resolve();
    });
    void exited.then(() => reject(new Error(`the worker process exited before taking jobs (code ${child.exitCode})`)));
  });
  ready.catch(() => undefined);
  return {
    child,
    ready,
    async stop() {
      if (child.exitCode === null && child.signalCode === null) child.kill('SIGTERM');
      await exited;
    },
  };
}

/**
 * Runs `work` with a worker process taking jobs: one already connected to the queue (the
 * server's, or the tests'), or one started for it and stopped after (the demo seed, benchmarks).
 */
export async function withWorkerProcess<T>(queues: JobQueues, work: () => Promise<T>): Promise<T> {
  if ((await queues.health()).workers > 0) return work();
  const worker = spawnWorker({ LOG_LEVEL: 'warn' });
  try {
    await worker.ready;
    return await work();
  } finally {
    await worker.stop();
  }
}
