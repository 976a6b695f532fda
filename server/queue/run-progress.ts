import type { Redis } from 'ioredis';

/** A run's member fractions outlive any worker that wrote them by far, and no run is open this long. */
const KEPT_MS = 24 * 3600_000;

/**
 * How far a run has got, counting members still simulating: a hash per run in Redis of each
 * member's fraction done (1 once stored), written by whichever worker holds the member. A run of
 * two 50-year members moves year by year instead of jumping from 0 to a half to done.
 */
export class RunProgress {
  constructor(
    private readonly redis: Redis,
    private readonly prefix: string,
  ) {}

  private key(runId: number): string {
    return `${this.prefix}:run-progress:${runId}`;
  }

  /** Records one member's fraction (0 … 1) and answers the run's share done, 0 … 1. */
  async report(runId: number, memberIndex: number, fraction: number, memberCount: number): Promise<number> {
    const key = this.key(runId);
    const answers = await this.redis.multi()
      .hset(key, String(memberIndex), String(Math.min(1, Math.max(0, fraction))))
      .pexpire(key, KEPT_MS)
      .hvals(key)
      .exec();
    const [error, values] = answers?.[2] ?? [new Error('no answer')];
    if (error) throw error;
    const done = (values as string[]).reduce((sum, v) => sum + Number(v), 0);
    return Math.min(1, done / memberCount);
  }

  /** Forgets a run's fractions once it has ended. */
  async forget(runId: number): Promise<void> {
    await this.redis.del(this.key(runId));
  }
}
