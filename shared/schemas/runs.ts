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

const wholeYear = (what: string) => z.number({ message: `must be a year (${what})` }).int('must be a whole year').min(1950, 'must be 1950 or later').max(2300, 'must be 2300 or earlier');

/**
 * A multi-decade (transient) run: the record's years repeated or resampled one after another,
 * warmed along a path that reaches a global warming level (°C above 1850–1900, as IPCC AR6 counts
 * them) by a chosen year and holds it, with a precipitation change reached in step; the glacier
 * shrinks or grows each year by its simulated balance (Δh-parameterisation, Huss et al. 2010).
 */
export const transientOptionsSchema = z.object({
  fromYear: wholeYear('first year'),
  years: z.number({ message: 'must be a whole number of years' }).int('must be a whole number of years').min(11, 'must be at least 11 years (peak water is an 11-year mean)').max(100, 'must be at most 100 years'),
  warmingLevelC: z.number({ message: 'must be a number (°C above 1850–1900)' }).min(1, 'must be at least 1 °C above 1850–1900').max(6, 'must be at most 6 °C above 1850–1900'),
  targetYear: wholeYear('year the warming level is reached'),
  /** Local warming per degree of global warming. */
  regionalFactor: z.number({ message: 'must be a number' }).min(0.5, 'must be at least 0.5').max(3, 'must be at most 3').default(1),
  /** Precipitation change when the warming level is reached, %. */
  precipitationChangePercent: z.number({ message: 'must be a number (%)' }).min(-50, 'must be at least −50 %').max(50, 'must be at most +50 %').default(0),
  /** The record's complete years in order, or drawn with replacement (seeded). */
  recordYears: z.enum(['repeat', 'resample'], { message: 'choose repeat or resample' }).default('repeat'),
  seed: z.number().int().min(1).max(2 ** 31 - 1).default(1),
}).strict().refine((t) => t.targetYear > t.fromYear, { path: ['targetYear'], message: 'must come after the first year' })
  .refine((t) => t.targetYear <= t.fromYear + t.years - 1 + 100, { path: ['targetYear'], message: 'must be within 100 years of the run' });
export type TransientOptions = z.output<typeof transientOptionsSchema>;
export type TransientOptionsInput = z.input<typeof transientOptionsSchema>;

/** What "start a run" asks for. */
/** A run's options besides its scenario, before the checks across them (a study shares these). */
export const runOptionsSchema = z.object({
  /** Split the added melt among its drivers with factor separation. */
  attribution: z.boolean().default(false),
  /** Latin hypercube ensemble members; 0 for none. */
  ensembleSize: z.number({ message: 'must be a whole number' }).int('must be a whole number')
    .min(0, 'must be 0 (no ensemble) or more').max(MAX_ENSEMBLE_SIZE, `must be at most ${MAX_ENSEMBLE_SIZE}`).default(0),
  ensembleSeed: z.number().int().min(1).max(2 ** 31 - 1).default(1),
  start: runStartSchema.default(DEFAULT_RUN_START),
  /** A multi-decade run instead of the scenario's period; null: the season run. */
  transient: transientOptionsSchema.nullable().default(null),
}).strict();

/** What a multi-decade run cannot have besides its years (a run and a study check the same). */
export function checkMultiDecadeOptions(r: z.output<typeof runOptionsSchema>, ctx: z.RefinementCtx): void {
  if (!r.transient) return;
  if (r.attribution) ctx.addIssue({ code: 'custom', path: ['attribution'], message: 'a multi-decade run has no attribution; run a season for it' });
  if (r.ensembleSize > 0) ctx.addIssue({ code: 'custom', path: ['ensembleSize'], message: 'a multi-decade run has no ensemble; run a season for it' });
  if (r.start.method !== 'spin-up') ctx.addIssue({ code: 'custom', path: ['start'], message: 'a multi-decade run spins up through its first year' });
}

export const startRunSchema = runOptionsSchema.extend({
  scenarioId: z.number({ message: 'choose a scenario' }).int().positive(),
}).strict().superRefine(checkMultiDecadeOptions);
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
  /** The warming path and record years of a multi-decade run; null for a season run. */
  transient: transientOptionsSchema.nullable(),
  queuedAt: z.string(),
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
});
export type Run = z.infer<typeof runSchema>;

export const runReplySchema = z.object({ run: runSchema, reused: z.boolean().optional() });
export const runListSchema = z.object({ runs: z.array(runSchema) });
