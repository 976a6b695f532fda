import { z } from 'zod';
import { MAX_ENSEMBLE_SIZE } from '../analysis/ensemble-parameters';

export const RUN_STATUSES = ['queued', 'running', 'done', 'failed', 'cancelled'] as const;
export type RunStatus = (typeof RUN_STATUSES)[number];
export const FINISHED_STATUSES: readonly RunStatus[] = ['done', 'failed', 'cancelled'];

/** What "start a run" asks for. */
export const startRunSchema = z.object({
  scenarioId: z.number({ message: 'choose a scenario' }).int().positive(),
  /** Split the added melt among its drivers with factor separation. */
  attribution: z.boolean().default(false),
  /** Latin hypercube ensemble members; 0 for none. */
  ensembleSize: z.number({ message: 'must be a whole number' }).int('must be a whole number')
    .min(0, 'must be 0 (no ensemble) or more').max(MAX_ENSEMBLE_SIZE, `must be at most ${MAX_ENSEMBLE_SIZE}`).default(0),
  ensembleSeed: z.number().int().min(1).max(2 ** 31 - 1).default(1),
}).strict();
export type StartRun = z.input<typeof startRunSchema>;
export type StartRunRequest = z.output<typeof startRunSchema>;

export const runSchema = z.object({
  id: z.number().int(),
  catchmentId: z.number().int(),
  scenarioId: z.number().int(),
  scenarioName: z.string(),
  isBaseline: z.boolean(),
  attribution: z.boolean(),
  ensembleSize: z.number().int(),
  status: z.enum(RUN_STATUSES),
  /** 0 … 1 */
  progress: z.number(),
  simulationCount: z.number().int(),
  errorMessage: z.string().nullable(),
  engineVersion: z.string(),
  inputHash: z.string(),
  period: z.object({ from: z.string(), to: z.string() }).nullable(),
  queuedAt: z.string(),
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
});
export type Run = z.infer<typeof runSchema>;

export const runReplySchema = z.object({ run: runSchema, reused: z.boolean().optional() });
export const runListSchema = z.object({ runs: z.array(runSchema) });
