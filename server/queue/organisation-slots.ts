import type { Redis } from 'ioredis';

/**
 * Takes a slot when the organisation has fewer than `limit` taken: a sorted set per organisation
 * of job ids scored by when their hold lapses, so a slot of a killed worker frees itself.
 */
const TAKE = `
redis.call('ZREMRANGEBYSCORE', KEYS[1], '-inf', ARGV[1])
if redis.call('ZSCORE', KEYS[1], ARGV[3]) or redis.call('ZCARD', KEYS[1]) < tonumber(ARGV[4]) then
  redis.call('ZADD', KEYS[1], ARGV[2], ARGV[3])
  redis.call('PEXPIRE', KEYS[1], ARGV[5])
  return 1
end
return 0`;

/**
 * The per-organisation limit on simulations running at once across every worker (fairness: one
 * organisation's regional study leaves room for everyone else's work). A job that finds its
 * organisation at the limit goes back to wait briefly; a held slot is renewed while it runs.
 */
export class OrganisationSlots {
  constructor(
    private readonly redis: Redis,
    private readonly prefix: string,
    private readonly limit: number,
    private readonly holdMs: number,
  ) {}

  private key(organisationId: number): string {
    return `${this.prefix}:organisation-slots:${organisationId}`;
  }

  /** True when the slot is taken (or renewed) for this job. */
  async take(organisationId: number, jobId: string): Promise<boolean> {
    const now = Date.now();
    const taken = await this.redis.eval(TAKE, 1, this.key(organisationId), now, now + this.holdMs, jobId, this.limit, this.holdMs * 4);
    return taken === 1;
  }

  async release(organisationId: number, jobId: string): Promise<void> {
    await this.redis.zrem(this.key(organisationId), jobId);
  }

  /** Slots the organisation holds now (tests and the queue page). */
  async held(organisationId: number): Promise<number> {
    await this.redis.zremrangebyscore(this.key(organisationId), '-inf', Date.now());
    return this.redis.zcard(this.key(organisationId));
  }
}
