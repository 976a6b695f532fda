import { z } from 'zod';

const months = z.array(z.number().nullable()).length(12);
const period = z.object({ from: z.string(), to: z.string() }).nullable();
const profile = z.union([
  z.object({ kind: z.literal('linear'), gradientPerKm: z.number() }),
  z.object({ kind: z.literal('peaked'), peakElevationM: z.number(), gradientBelowPerKm: z.number(), decreaseAbovePerKm: z.number() }),
]);

/** How a month's gradient came about, as the product says it. */
export const GRADIENT_ORIGIN_LABELS = { fitted: 'Fitted', assumed: 'Assumed, not fitted', 'set by hand': 'Set by hand' } as const;

/**
 * The vertical gradients fitted from a catchment's stations over their common period: per month
 * the lapse rate by least squares (with standard error and r²), the precipitation profile (linear
 * or peaked, per month or on annual totals), what is chosen for each month once hand-set values
 * are applied, and the bands they are applied to.
 */
export const gradientsReplySchema = z.object({
  referenceElevationM: z.number(),
  stations: z.array(z.object({
    id: z.number().int(),
    name: z.string(),
    network: z.string(),
    elevationM: z.number(),
    isReference: z.boolean(),
    monthlyTemperatureC: months.nullable(),
    monthlyPrecipitationMm: months.nullable(),
    /** Sum of the twelve monthly totals; null unless all twelve exist. */
    annualPrecipitationMm: z.number().nullable(),
  })),
  periods: z.object({ temperature: period, precipitation: period }),
  lapseRates: z.array(z.object({
    month: z.number().int(),
    lapseRateKPerKm: z.number(),
    standardErrorKPerKm: z.number().nullable(),
    interceptC: z.number().nullable(),
    r2: z.number().nullable(),
    n: z.number().int(),
    status: z.enum(['fitted', 'assumed']),
    note: z.string(),
  })),
  precipitationFits: z.array(z.object({
    /** "Annual totals" or the month's name. */
    label: z.string(),
    profile,
    referencePrecipitationMm: z.number(),
    standardErrors: z.record(z.string(), z.number().nullable()),
    r2: z.number().nullable(),
    n: z.number().int(),
    status: z.enum(['fitted', 'assumed']),
    notes: z.array(z.string()),
  })),
  precipitationPerMonth: z.boolean(),
  chosen: z.object({
    lapseRatesKPerKm: z.array(z.number()),
    profiles: z.array(profile),
    lapseRateOrigin: z.array(z.string()),
    profileOrigin: z.array(z.string()),
  }),
  bands: z.array(z.object({ midM: z.number(), areaKm2: z.number(), glacierFraction: z.number() })),
  /** Per band × month (band-major) relative to the reference station, as the engine gets it. */
  bandClimate: z.object({ temperatureOffsetK: z.array(z.number()), glacierTemperatureOffsetK: z.array(z.number()), precipitationMultiplier: z.array(z.number()) }),
  /** Whether runs take band climate from these gradients (the catchment's water settings). */
  inUse: z.boolean(),
  notes: z.array(z.string()),
});
export type GradientsReply = z.infer<typeof gradientsReplySchema>;
