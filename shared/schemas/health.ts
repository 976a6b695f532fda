import { z } from 'zod';

/**
 * GET /api/health: whether the API, its database and its job queue answer. `redis` is the
 * queue's store; `workers` the worker processes connected to it (runs wait while there are none).
 */
export const healthSchema = z.object({
  status: z.enum(['ok', 'degraded']),
  db: z.enum(['up', 'down']),
  redis: z.enum(['up', 'down']),
  workers: z.number().int().min(0),
});
export type Health = z.infer<typeof healthSchema>;
