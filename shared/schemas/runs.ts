import { z } from 'zod';
import { MAX_ENSEMBLE_SIZE } from '../analysis/ensemble-parameters';

export const RUN_STATUSES = ['queued', 'running', 'done', 'failed', 'cancelled'] as const;
export type RunStatus = (typeof RUN_STATUSES)[number];
export const FINISHED_STATUSES: readonly RunStatus[] = ['done', 'failed', 'cancelled'];

/**
 * How a run's simulations start: by default the engine first runs through the record before the
 * period (from the start of a hydrological year) so snow and temperatures are built up, and only
 * the period is reported; or the snow water equivalent on each band at the period's start is
 * given (from a snow survey), in band order.
 */
export const runStartSchema = z.discriminatedUnion('method', [
  z.object({
    method: z.literal('spin-up'),
    years: z.number({ message: 'must be a whole number of years' }).int('must be a whole number of years').min(1, 'must be at least 1 year').max(5, 'must be at most 5 years').default(1),
  }).strict(),
  z.object({
    method: z.literal('initial-swe'),
    sweMm: z.array(z.number({ message: 'must be a number of millimetres' }).min(0, 'must not be negative').max(1e6, 'must be at most 1,000,000 mm'))
      .min(1, 'give one value per band').max(500),
  }).strict(),
], { message: 'choose a spin-up or a snow water equivalent per band' });
export type RunStart = z.output<typeof runStartSchema>;
export const DEFAULT_RUN_START: RunStart = { method: 'spin-up', years: 1 };

/** What "start a run" asks for. */
export const startRunSchema = z.object({
  scenarioId: z.number({ message: 'choose a scenario' }).int().positive(),
  /** Split the added melt among its drivers with factor separation. */
  attribution: z.boolean().default(false),
  /** Latin hypercube ensemble members; 0 for none. */
  ensembleSize: z.number({ message: 'must be a whole number' }).int('must be a whole number')
    .min(0, 'must be 0 (no ensemble) or more').max(MAX_ENSEMBLE_SIZE, `must be at most ${MAX_ENSEMBLE_SIZE}`).default(0),
  ensembleSeed: z.number().int().min(1).max(2 ** 31 - 1).default(1),
  start: runStartSchema.default(DEFAULT_RUN_START),
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
  /** As requested; runs made before engine 2.0 have none. */
  start: runStartSchema.nullable(),
  queuedAt: z.string(),
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
});
export type Run = z.infer<typeof runSchema>;

export const runReplySchema = z.object({ run: runSchema, reused: z.boolean().optional() });
export const runListSchema = z.object({ runs: z.array(runSchema) });
