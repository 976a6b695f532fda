import { spawnWorker, type WorkerProcess } from '../../server/queue/worker-process';

/**
 * The API and browser suites' worker process: runs and lab computations started by the tests go
 * through the real queue to it, as in production. Tests that kill or restart workers start their
 * own, on a Redis and queue prefix of their own (tests/api/queue-faults.test.ts).
 */
let worker: WorkerProcess | undefined;

export async function setup(): Promise<void> {
  worker = spawnWorker({ NODE_ENV: 'test' });
  await worker.ready;
}

export async function teardown(): Promise<void> {
  await worker?.stop();
}
