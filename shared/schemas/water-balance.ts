import { z } from 'zod';
import { labPeriodSchema } from './lab';

/** What the lab's water-balance closure may look for: the precipitation factor and the profile's parameters. */
export const BALANCE_UNKNOWNS = ['precipitationFactor', 'gradientPerKm', 'peakElevationM', 'gradientBelowPerKm', 'decreaseAbovePerKm'] as const;
export const BALANCE_UNKNOWN_LABELS: Record<(typeof BALANCE_UNKNOWNS)[number], string> = {
  precipitationFactor: 'Precipitation factor',
  gradientPerKm: 'Precipitation gradient',
  peakElevationM: 'Elevation of the precipitation maximum',
  gradientBelowPerKm: 'Increase below the maximum',
  decreaseAbovePerKm: 'Decrease above the maximum',
};
const PROFILE_UNKNOWNS = { linear: ['precipitationFactor', 'gradientPerKm'], peaked: ['precipitationFactor', 'peakElevationM', 'gradientBelowPerKm', 'decreaseAbovePerKm'] } as const;

/**
 * POST /api/lab/catchments/:id/water-balance: find the precipitation correction and profile that
 * close the catchment's water balance over a period, against the measured runoff and, where
 * stakes exist, the glacier balance per band.
 */
export const waterBalanceRequestSchema = z.object({
  period: labPeriodSchema,
  form: z.enum(['linear', 'peaked']).default('linear'),
  unknowns: z.array(z.enum(BALANCE_UNKNOWNS)).min(1, 'choose at least one quantity to find').max(4, 'choose at most four quantities')
    .refine((u) => new Set(u).size === u.length, { message: 'choose each quantity once' }),
  /** The gauge's stated accuracy, % of the runoff; default from the discharge record's stated accuracy (else 10 %). */
  runoffUncertaintyPercent: z.number({ message: 'must be a number (%)' }).min(0.5, 'must be at least 0.5 %').max(100, 'must be at most 100 %').optional(),
  /** Compare the glacier balance per band with the stake readings inside the period. */
  useStakes: z.boolean().default(true),
  /** The stakes' stated accuracy, mm w.e.; default from the stake record's stated accuracy (else 200 mm). */
  stakeUncertaintyMm: z.number({ message: 'must be a number (mm w.e.)' }).min(10, 'must be at least 10 mm').max(5000, 'must be at most 5000 mm').optional(),
  /** Whether the stated accuracies are one standard uncertainty or a 95 % range (twice it). */
  accuracyMeaning: z.enum(['one-sigma', 'two-sigma']).default('one-sigma'),
}).superRefine((r, ctx) => {
  r.unknowns.forEach((u, i) => {
    if (!(PROFILE_UNKNOWNS[r.form] as readonly string[]).includes(u)) ctx.addIssue({ code: 'custom', path: ['unknowns', i], message: `the ${BALANCE_UNKNOWN_LABELS[u].toLowerCase()} is not part of a ${r.form} profile` });
  });
});
export type WaterBalanceRequest = z.output<typeof waterBalanceRequestSchema>;
export type WaterBalanceRequestInput = z.input<typeof waterBalanceRequestSchema>;

const profile = z.union([
  z.object({ kind: z.literal('linear'), gradientPerKm: z.number() }),
  z.object({ kind: z.literal('peaked'), peakElevationM: z.number(), gradientBelowPerKm: z.number(), decreaseAbovePerKm: z.number() }),
]);
const terms = z.object({
  precipitationMm: z.number(), measuredRunoffMm: z.number(), modelledRunoffMm: z.number(), evaporationSublimationMm: z.number(),
  snowStorageChangeMm: z.number(), iceStorageChangeMm: z.number(), storesChangeMm: z.number(), closureMm: z.number(),
});
const measured = z.object({ value: z.number(), uncertainty: z.number() });

/** What a closure found (or, when it cannot close, its nearest attempt and why). */
export const waterBalanceClosureSchema = z.object({
  closed: z.boolean(),
  /** Plain sentences: how it closed, or why it cannot. */
  messages: z.array(z.string()),
  period: z.object({ from: z.string(), to: z.string() }),
  form: z.enum(['linear', 'peaked']),
  unknowns: z.array(z.string()),
  candidate: z.object({ precipitationFactor: z.number(), profile }),
  station: z.object({ precipitationFactor: z.number(), profile }),
  /** One standard uncertainty of each unknown found; null where the observations do not determine it. */
  uncertainty: z.record(z.string(), z.number().nullable()),
  balance: terms,
  stationBalance: terms,
  /** Inferred over station precipitation, catchment means, with its standard uncertainty (NaN-free: null when unknown). */
  precipitationRatio: z.object({ value: z.number(), uncertainty: z.number().nullable() }),
  misfits: z.array(z.object({ label: z.string(), sigmas: z.number() })),
  bands: z.array(z.object({ midM: z.number(), areaKm2: z.number(), stationPrecipitationMm: z.number(), inferredPrecipitationMm: z.number() })),
  observations: z.object({
    runoff: measured.extend({ days: z.number().int(), filledDays: z.number().int(), source: z.string() }),
    bandBalances: z.array(measured.extend({ band: z.number().int(), midM: z.number(), stakes: z.number().int() })),
  }),
  evaluations: z.number().int(),
});
export type WaterBalanceClosure = z.infer<typeof waterBalanceClosureSchema>;

export const savedClosureSchema = z.object({
  id: z.number().int(),
  closure: waterBalanceClosureSchema,
  note: z.string(),
  savedBy: z.string(),
  savedAt: z.string(),
});
export type SavedClosure = z.infer<typeof savedClosureSchema>;
export const closureHistorySchema = z.object({ current: savedClosureSchema.nullable(), history: z.array(savedClosureSchema) });
/** PUT …/water-balance: keep a closed balance as the catchment's water-balance precipitation. */
export const saveClosureSchema = z.object({ jobId: z.number({ message: 'choose a finished closure' }).int().positive(), note: z.string().trim().max(500).default('') });
