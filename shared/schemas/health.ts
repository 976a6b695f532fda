import { z } from 'zod';

/** GET /api/health: whether the API and its database answer. */
export const healthSchema = z.object({ status: z.enum(['ok', 'degraded']), db: z.enum(['up', 'down']) });
export type Health = z.infer<typeof healthSchema>;
