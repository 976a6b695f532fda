import { Queue, QueueEvents } from 'bullmq';
import type { Redis } from 'ioredis';
import type { AppConfig } from '../config';
import { createRedis, redisOptions } from './connection';
import type { LabJobData, LabJobRunData, MemberJobData, QueueName } from './jobs';

/** What the health check and the queue page say about the queue. */
export interface QueueHealth {
  redis: 'up' | 'down';
  /** Worker processes connected to the simulations queue. */
  workers: number;
}

/**
 * The API's side of the queue: the three queues it adds jobs to, one listener for lab results and
 * progress, and a publisher for cancels. Connections open on first use and reconnect by themselves.
 */
export class JobQueues {
  readonly simulations;
  readonly lab;
  readonly labJobs;
  private events: QueueEvents | null = null;
  private publisher: Redis | null = null;

  constructor(readonly settings: AppConfig['queue'], onError: (error: Error) => void = () => undefined) {
    const options = { connection: redisOptions(settings), prefix: settings.prefix };
    this.simulations = new Queue<MemberJobData>('simulations', options);
    this.lab = new Queue<LabJobData>('lab', options);
    this.labJobs = new Queue<LabJobRunData>('lab-jobs', options);
    // While Redis is away every reconnect attempt fails: said once per ten seconds, not per attempt.
    let last = 0;
    const report = (error: Error) => {
      if (Date.now() - last < 10_000) return;
      last = Date.now();
      onError(error);
    };
    this.simulations.on('error', report);
    this.lab.on('error', report);
    this.labJobs.on('error', report);
  }

  queue(name: QueueName) {
    return name === 'simulations' ? this.simulations : name === 'lab' ? this.lab : this.labJobs;
  }

  /** Completion and progress of lab jobs (one listener for the process). */
  labEvents(): QueueEvents {
    if (!this.events) {
      this.events = new QueueEvents('lab', { connection: redisOptions(this.settings), prefix: this.settings.prefix });
      this.events.on('error', () => undefined);
    }
    return this.events;
  }

  /** Tells every worker process something (cancels). */
  async publish(channel: string, message: string): Promise<void> {
    this.publisher ??= createRedis(this.settings);
    await this.publisher.publish(`${this.settings.prefix}:${channel}`, message);
  }

  /** Whether Redis answers within a second, and how many worker processes are connected. */
  async health(): Promise<QueueHealth> {
    const down: QueueHealth = { redis: 'down', workers: 0 };
    // Commands wait while Redis is away (they are not failed), so the answer is bounded by a timer.
    const check = async (): Promise<QueueHealth> => {
      await this.simulations.waitUntilReady();
      return { redis: 'up', workers: await this.simulations.getWorkersCount() };
    };
    let timer: NodeJS.Timeout | undefined;
    const late = new Promise<QueueHealth>((resolve) => { timer = setTimeout(() => resolve(down), 1000); });
    try {
      return await Promise.race([check().catch(() => down), late]);
    } finally {
      clearTimeout(timer);
    }
  }

  async close(): Promise<void> {
    await Promise.all([this.simulations.close(), this.lab.close(), this.labJobs.close(), this.events?.close()]);
    this.publisher?.disconnect();
  }
}
