import type { RedisOptions } from 'bullmq';
import { Redis } from 'ioredis';
import type { AppConfig } from '../config';

/**
 * Connection settings every queue, worker and listener shares. `maxRetriesPerRequest: null` keeps
 * commands waiting while Redis is away (a restart) instead of failing them; ioredis reconnects by
 * itself, backing off up to two seconds between tries.
 */
export function redisOptions(queue: AppConfig['queue']): RedisOptions {
  return {
    host: queue.redis.host,
    port: queue.redis.port,
    password: queue.redis.password,
    db: queue.redis.db,
    maxRetriesPerRequest: null,
    enableReadyCheck: true,
    retryStrategy: (times) => Math.min(2000, 50 * 2 ** Math.min(times, 6)),
  };
}

/** A Redis client of its own (publishers and subscribers cannot share one with the queues). */
export function createRedis(queue: AppConfig['queue']): Redis {
  return new Redis(redisOptions(queue));
}
