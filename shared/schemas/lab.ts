import { z } from 'zod';
import { daysBetween, isIsoDate } from '../melt/calendar';
import { PARAMETER_SPECS } from '../melt/parameters';
import { CALIBRATION_KEYS, keySpec } from '../lab/calibration-set';
import { MAX_SWEEP_STEPS, SWEEP_VARIABLES, variableSpec, type SweepVariable } from '../lab/sweep';

const isoDate = z.string().refine(isIsoDate, { message: 'must be a real date written YYYY-MM-DD' });

export const labPeriodSchema = z.object({ from: isoDate, to: isoDate })
  .refine((p) => daysBetween(p.from, p.to) >= 1, { path: ['to'], message: 'must be at least one day after the start of the period' })
  .refine((p) => daysBetween(p.from, p.to) <= 366 * 5, { path: ['to'], message: 'the lab works on periods of at most five years' });
export type LabPeriod = z.infer<typeof labPeriodSchema>;

/** Query of the band curves: which band (0 = lowest) and when. */
export const bandQuerySchema = z.object({
  band: z.coerce.number({ message: 'must be a band number' }).int('must be a whole number').min(0, 'must be 0 or more'),
  from: isoDate,
  to: isoDate,
}).refine((q) => daysBetween(q.from, q.to) >= 1, { path: ['to'], message: 'must be at least one day after from' })
  .refine((q) => daysBetween(q.from, q.to) <= 366, { path: ['to'], message: 'surface response covers at most one year' });
export type BandQuery = z.infer<typeof bandQuerySchema>;

const calibrationParameters = z.object(Object.fromEntries(CALIBRATION_KEYS.filter((k) => k !== 'precipitationFactor').map((key) => {
  const { min, max, unit } = PARAMETER_SPECS[key as keyof typeof PARAMETER_SPECS];
  return [key, z.number({ message: 'must be a number' }).min(min, `must be at least ${min} ${unit}`).max(max, `must be at most ${max} ${unit}`).optional()];
})) as Record<string, z.ZodOptional<z.ZodNumber>>).strict();

/** A set of adjusted parameters: the engine parameters the lab adjusts and the precipitation factor. */
export const calibrationSetSchema = z.object({
  parameters: calibrationParameters.default({}),
  precipitationFactor: z.number({ message: 'must be a number' })
    .min(keySpec('precipitationFactor').min, `must be at least ${keySpec('precipitationFactor').min}`)
    .max(keySpec('precipitationFactor').max, `must be at most ${keySpec('precipitationFactor').max}`).default(1),
});
export type CalibrationSetInput = z.input<typeof calibrationSetSchema>;

export const skillRequestSchema = z.object({ period: labPeriodSchema, set: calibrationSetSchema.optional() });
export type SkillRequest = z.output<typeof skillRequestSchema>;
export const stakeSkillRequestSchema = z.object({ set: calibrationSetSchema.optional() });
export type StakeSkillRequest = z.output<typeof stakeSkillRequestSchema>;
export const saveCalibrationSchema = z.object({ period: labPeriodSchema, set: calibrationSetSchema, note: z.string().trim().max(500).default('') });
export type SaveCalibrationRequest = z.output<typeof saveCalibrationSchema>;

export const calibrateRequestSchema = z.object({
  /** What the search fits: daily discharge (KGE), stake balances (KGE over the readings), snow-cover maps (KGE over bands and dates) or the geodetic balance profile (σ-weighted squared error). */
  target: z.enum(['discharge', 'stakes', 'snowCover', 'geodetic']).default('discharge'),
  keys: z.array(z.enum(CALIBRATION_KEYS)).min(1, 'choose at least one parameter').max(4, 'choose at most four parameters')
    .refine((k) => new Set(k).size === k.length, { message: 'each parameter may be chosen once' }),
  period: labPeriodSchema,
  validationPeriod: labPeriodSchema.optional(),
  maxEvaluations: z.number().int().min(10).max(400).default(120),
  seed: z.number().int().min(0).max(2 ** 31).default(1),
});
export type CalibrateRequest = z.input<typeof calibrateRequestSchema>;
export type CalibrationJobRequest = z.output<typeof calibrateRequestSchema>;

const sweepAxisSchema = z.object({
  variable: z.enum(SWEEP_VARIABLES as [SweepVariable, ...SweepVariable[]]),
  from: z.number({ message: 'must be a number' }),
  to: z.number({ message: 'must be a number' }),
  steps: z.number().int().min(2, 'must be at least 2').max(MAX_SWEEP_STEPS, `must be at most ${MAX_SWEEP_STEPS}`),
}).superRefine((axis, ctx) => {
  const { min, max, unit } = variableSpec(axis.variable);
  for (const end of ['from', 'to'] as const) {
    if (axis[end] < min || axis[end] > max) ctx.addIssue({ code: 'custom', path: [end], message: `must be between ${min} and ${max} ${unit}` });
  }
  if (axis.from === axis.to) ctx.addIssue({ code: 'custom', path: ['to'], message: 'must differ from from' });
});

export const sweepRequestSchema = z.object({
  axes: z.array(sweepAxisSchema).min(1, 'give one or two parameters').max(2, 'give one or two parameters')
    .refine((a) => a.length < 2 || a[0].variable !== a[1].variable, { message: 'the two axes must vary different parameters' }),
  period: labPeriodSchema,
});
export type SweepRequest = z.input<typeof sweepRequestSchema>;
export type SweepJobRequest = z.output<typeof sweepRequestSchema>;

// Replies

export const skillScoresSchema = z.object({
  count: z.number(), nse: z.number(), kge: z.number(), r: z.number(), alpha: z.number(), beta: z.number(),
  biasPercent: z.number(), meanObserved: z.number(), meanSimulated: z.number(),
});
export type SkillScoresReply = z.infer<typeof skillScoresSchema>;
const pairedSeriesSchema = z.object({ dates: z.array(z.string()), observed: z.array(z.number()), simulated: z.array(z.number()) });
export const dischargeEvaluationSchema = z.object({ daily: skillScoresSchema, monthly: skillScoresSchema.nullable(), series: pairedSeriesSchema, monthlySeries: pairedSeriesSchema });
export type DischargeEvaluationReply = z.infer<typeof dischargeEvaluationSchema>;
export const setReplySchema = z.object({ parameters: z.record(z.string(), z.number()), precipitationFactor: z.number() });

export const skillReplySchema = z.object({ set: setReplySchema, evaluation: dischargeEvaluationSchema });

const stakeComparisonSchema = z.object({
  readings: z.array(z.object({ stake: z.string(), elevationM: z.number(), from: z.string(), to: z.string(), balanceMWe: z.number(), bandIndex: z.number(), simulatedMWe: z.number() })),
  outsideRecord: z.number(),
  scores: skillScoresSchema.nullable(),
  meanErrorMWe: z.number(),
  rmseMWe: z.number(),
});
export const stakeSkillReplySchema = z.object({ set: setReplySchema, comparison: stakeComparisonSchema });
export type StakeSkillReply = z.infer<typeof stakeSkillReplySchema>;

export const savedCalibrationSchema = z.object({
  id: z.number().int(),
  set: setReplySchema,
  period: z.object({ from: z.string(), to: z.string() }),
  scores: z.object({ daily: skillScoresSchema, monthly: skillScoresSchema.nullable() }),
  note: z.string(),
  savedBy: z.string(),
  savedAt: z.string(),
});
export type SavedCalibration = z.infer<typeof savedCalibrationSchema>;
export const calibrationHistorySchema = z.object({ current: savedCalibrationSchema.nullable(), history: z.array(savedCalibrationSchema) });

const ostremPointSchema = z.object({ thicknessM: z.number(), meltMm: z.number() });
const ostremCurveSchema = z.object({
  label: z.string(), temperatureDeltaC: z.number(), debrisAlbedo: z.number(), points: z.array(ostremPointSchema),
  cleanIceMeltMm: z.number(), snowMeltMm: z.number(), peak: ostremPointSchema, criticalThicknessM: z.number().nullable(),
});
export type OstremCurveReply = z.infer<typeof ostremCurveSchema>;
const perC = z.object({ thicknessM: z.number(), perC: z.number() });

export const surfaceResponseSchema = z.object({
  band: z.object({ index: z.number().int(), lowerM: z.number(), upperM: z.number(), debrisThicknessM: z.number(), glacierFraction: z.number() }),
  period: z.object({ from: z.string(), to: z.string() }),
  set: setReplySchema,
  ostrem: z.object({ present: ostremCurveSchema, warmer: z.array(ostremCurveSchema), darker: ostremCurveSchema }),
  warming: z.object({ cleanIcePerC: z.number(), snowPerC: z.number(), debris: z.array(perC), bandDebris: perC.nullable() }),
  impurity: z.array(z.object({ surface: z.string(), label: z.string(), points: z.array(z.object({ blackCarbonNgG: z.number(), meltMm: z.number() })) })),
});
export type SurfaceResponse = z.infer<typeof surfaceResponseSchema>;

export const referenceModelsSchema = z.object({
  dates: z.array(z.string()),
  models: z.array(z.object({ key: z.string(), label: z.string(), dailyMm: z.array(z.number()), totalMm: z.number(), snowMm: z.number(), iceMm: z.number() })),
});
export type ReferenceModels = z.infer<typeof referenceModelsSchema>;

export const sweepResultSchema = z.object({
  axes: z.array(z.object({ variable: z.string(), label: z.string(), unit: z.string(), values: z.array(z.number()) })),
  period: z.object({ from: z.string(), to: z.string() }),
  baselineMeltMm: z.number(),
  meltMm: z.array(z.array(z.number())),
  addedMeltMm: z.array(z.array(z.number())),
});
export type SweepResultReply = z.infer<typeof sweepResultSchema>;

const periodReply = z.object({ from: z.string(), to: z.string() });
/** A parameter's behavioural range around the calibrated value; open when the data do not bound it within the sampled region. */
const parameterRangeSchema = z.object({ key: z.string(), best: z.number(), low: z.number(), high: z.number(), open: z.boolean() });
/** What every automatic calibration reports about its search, whatever it was scored against. */
export const searchFacts = {
  keys: z.array(z.string()),
  set: setReplySchema,
  evaluations: z.number(),
  converged: z.boolean(),
  atBounds: z.array(z.string()),
  ranges: z.array(parameterRangeSchema),
};
export const calibrationResultSchema = z.discriminatedUnion('target', [
  z.object({
    target: z.literal('discharge'),
    ...searchFacts,
    startScores: dischargeEvaluationSchema,
    scores: dischargeEvaluationSchema,
    validation: z.object({ period: periodReply, before: dischargeEvaluationSchema, after: dischargeEvaluationSchema }).nullable(),
  }),
  z.object({
    target: z.literal('stakes'),
    ...searchFacts,
    start: stakeComparisonSchema,
    result: stakeComparisonSchema,
    validation: z.object({ period: periodReply, before: stakeComparisonSchema, after: stakeComparisonSchema }).nullable(),
  }),
]);
export type CalibrationResultReply = z.infer<typeof calibrationResultSchema>;

export const LAB_JOB_KINDS = ['sweep', 'calibration', 'water-balance'] as const;
export const LAB_JOB_STATUSES = ['queued', 'running', 'done', 'failed', 'cancelled'] as const;
export const labJobSchema = z.object({
  id: z.number().int(),
  catchmentId: z.number().int(),
  kind: z.enum(LAB_JOB_KINDS),
  status: z.enum(LAB_JOB_STATUSES),
  progress: z.number(),
  message: z.string(),
  error: z.string().nullable(),
  result: z.unknown().nullable(),
  createdBy: z.string(),
  createdAt: z.string(),
  finishedAt: z.string().nullable(),
});
export type LabJob = z.infer<typeof labJobSchema>;
