import { hostname } from 'node:os';
import { UnrecoverableError, Worker, type Job } from 'bullmq';
import { loadConfig, type AppConfig } from './config';
import { createDb } from './db';
import { createLogger, safeError, type Logger } from './logger';
import { createRedis, redisOptions } from './queue/connection';
import { JobQueues } from './queue/job-queues';
import { CANCEL_CHANNEL, CANCEL_LAB_CHANNEL, CANCEL_LAB_JOB_CHANNEL, JOB_OPTIONS, labJobQueueId, type LabJobData, type LabJobRunData, type MemberJobData } from './queue/jobs';
import { labJobProcessor } from './queue/lab-job-processor';
import { labProcessor } from './queue/lab-processor';
import { failRun, memberProcessor, messageOf } from './queue/member-processor';
import { OrganisationSlots } from './queue/organisation-slots';
import { RunInputsCache } from './queue/run-inputs-cache';
import { RunProgress } from './queue/run-progress';
import { LabPool } from './services/lab/lab-pool';
import { LabQueue } from './services/lab/lab-queue';
import { RunQueue } from './services/runs/run-queue';
import { SimulationPool } from './services/runs/simulation-pool';
import { settledWithin } from './services/settled-within';
import { ThreadBudget } from './services/thread-budget';

/** Lab jobs one worker process carries out at once (each mostly waiting for its steps). */
const LAB_JOBS_AT_ONCE = 4;

export interface RunningWorker {
  /** Stops taking jobs, waits up to `graceMs` for those in hand (the rest go back to the queue), then closes. */
  close(graceMs: number): Promise<void>;
}

/** Job ids a worker holds, by run: a cancel names runs. */
class HeldJobs {
  private readonly byRun = new Map<number, Set<string>>();
  add(runId: number, jobId: string): void {
    if (!this.byRun.has(runId)) this.byRun.set(runId, new Set());
    this.byRun.get(runId)!.add(jobId);
  }
  remove(runId: number, jobId: string): void {
    this.byRun.get(runId)?.delete(jobId);
    if (this.byRun.get(runId)?.size === 0) this.byRun.delete(runId);
  }
  of(runId: number): string[] {
    return [...(this.byRun.get(runId) ?? [])];
  }
}

/**
 * A worker process: takes run members and lab computations from the queues in Redis and runs
 * them on its own worker threads (WORKER_THREADS), carries out lab jobs (adding their steps to
 * the lab queue), and writes results to MariaDB. Any number of
 * them, on any machine that reaches the same Redis and MariaDB, share the work.
 */
export async function startWorker(config: AppConfig, logger: Logger): Promise<RunningWorker> {
  const db = createDb(config.db, logger);
  const threads = new ThreadBudget(config.workerThreads);
  const simulations = new SimulationPool(threads);
  const labPool = new LabPool(threads);
  const queues = new JobQueues(config.queue);
  const runQueue = new RunQueue(db, queues);
  const redis = createRedis(config.queue);
  const slots = new OrganisationSlots(redis, config.queue.prefix, config.queue.organisationConcurrency, Math.max(config.queue.lockMs, 5000));
  const held = new HeldJobs();
  const common = {
    connection: redisOptions(config.queue),
    prefix: config.queue.prefix,
    name: `${hostname()}:${process.pid}`,
    lockDuration: config.queue.lockMs,
    stalledInterval: config.queue.lockMs,
    maxStalledCount: 3,
  };
  const memberWorker = new Worker<MemberJobData>('simulations', memberProcessor({
    db, pool: simulations, slots, inputs: new RunInputsCache(db), progress: new RunProgress(redis, config.queue.prefix), logger, holding: held,
  }), { ...common, concurrency: threads.threads * 2 });
  const labWorker = new Worker<LabJobData>('lab', labProcessor(labPool, logger), { ...common, concurrency: threads.threads * 2 });
  // A lab job mostly waits for its steps (taken by the lab workers of every process): a few at once, on a worker of their own so they never hold the steps' places.
  const labJobWorker = new Worker<LabJobRunData>('lab-jobs', labJobProcessor({ db, runner: new LabQueue(queues, config.workerThreads), logger }), { ...common, concurrency: LAB_JOBS_AT_ONCE });

  memberWorker.on('failed', (job: Job<MemberJobData> | undefined, error: Error) => {
    if (!job) return;
    const final = error instanceof UnrecoverableError || error.name === 'UnrecoverableError' || job.attemptsMade >= (job.opts.attempts ?? JOB_OPTIONS.attempts!);
    logger.warn({ jobId: job.id, runId: job.data.runId, attempts: job.attemptsMade, final }, 'simulation job failed');
    if (!final) return;
    const message = error instanceof UnrecoverableError ? messageOf(error) : `The simulation could not be finished after ${job.attemptsMade} attempts: ${messageOf(error)}`;
    // The run fails once, with the message; its other jobs are stopped.
    void failRun(db, job.data.runId, message)
      .then(async (changed) => {
        if (!changed) return;
        const run = await db('runs').where('id', job.data.runId).first('simulation_count');
        await runQueue.stop([{ runId: job.data.runId, memberCount: run?.simulation_count ?? 0 }]);
      })
      .catch((e: unknown) => logger.error({ jobId: job.id, err: safeError(e) }, 'could not record a failed run'));
  });
  for (const worker of [memberWorker, labWorker, labJobWorker]) {
    worker.on('stalled', (jobId) => logger.warn({ jobId, queue: worker.name }, 'job stalled; back to the queue'));
    worker.on('error', (e) => logger.error({ queue: worker.name, err: safeError(e) }, 'queue error'));
  }

  const subscriber = createRedis(config.queue);
  const runChannel = `${config.queue.prefix}:${CANCEL_CHANNEL}`;
  const labChannel = `${config.queue.prefix}:${CANCEL_LAB_CHANNEL}`;
  const labJobChannel = `${config.queue.prefix}:${CANCEL_LAB_JOB_CHANNEL}`;
  subscriber.on('message', (channel: string, message: string) => {
    if (channel === runChannel) {
      for (const runId of JSON.parse(message) as number[]) for (const jobId of held.of(runId)) memberWorker.cancelJob(jobId, 'cancelled');
    } else if (channel === labChannel) {
      labWorker.cancelJob(message, 'cancelled');
    } else if (channel === labJobChannel) {
      labJobWorker.cancelJob(labJobQueueId(Number(message)), 'cancelled');
    }
  });
  await subscriber.subscribe(runChannel, labChannel, labJobChannel);
  await Promise.all([memberWorker.waitUntilReady(), labWorker.waitUntilReady(), labJobWorker.waitUntilReady()]);
  simulations.warm();
  logger.info({ threads: threads.threads, worker: common.name }, 'worker taking jobs');

  return {
    async close(graceMs: number) {
      const workers = [memberWorker, labWorker, labJobWorker];
      const closing = Promise.all(workers.map((w) => w.close()));
      if (!(await settledWithin(closing, graceMs))) await Promise.all(workers.map((w) => w.close(true)));
      subscriber.disconnect();
      redis.disconnect();
      await queues.close();
      await Promise.all([simulations.close(), labPool.close()]);
      await db.destroy();
    },
  };
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const config = loadConfig();
  const logger = createLogger(config.log);
  const worker = await startWorker(config, logger);
  // A parent that started this process (server/queue/worker-process.ts) waits for this.
  process.send?.('ready');
  for (const signal of ['SIGTERM', 'SIGINT'] as const) {
    process.once(signal, () => {
      logger.info({ signal }, 'worker stopping');
      void worker.close(config.shutdownGraceMs).then(() => process.exit(0));
    });
  }
}
