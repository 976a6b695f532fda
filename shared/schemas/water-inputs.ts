import { z } from 'zod';
import { redistributionSchema, routingSchema } from '../melt/water-side-schema';
import { glacierSettingsSchema } from './water-settings';

const profileSchema = z.union([
  z.object({ kind: z.literal('linear'), gradientPerKm: z.number() }),
  z.object({ kind: z.literal('peaked'), peakElevationM: z.number(), gradientBelowPerKm: z.number(), decreaseAbovePerKm: z.number() }),
]);
const origin = z.enum(['fitted', 'assumed', 'set by hand']);

/**
 * The water side of a catchment's stored inputs, as the server assembles it from the catchment's
 * settings, stations and kept water-balance closure: what runs hash and the builder's preview uses.
 */
export const waterInputsSchema = z.object({
  /** The monthly gradients chosen from the stations (fitted, assumed or set by hand); null: the engine's own lapse rate and gradient. */
  gradients: z.object({
    lapseRatesKPerKm: z.array(z.number()).length(12),
    profiles: z.array(profileSchema).length(12),
    damping: z.object({ lengthScaleM: z.number(), flowlineGradient: z.number(), referenceMonthlyTemperatureC: z.array(z.number()).length(12) }).nullable(),
    /** How each month's lapse rate and profile came about, and from how many stations: for the run's set-up. */
    origin: z.object({ lapseRate: z.array(origin), profile: z.array(origin), stationCount: z.number().int() }),
  }).nullable(),
  /** The newest kept water-balance closure: the factor and profile that close the balance, and where it came from; null when none is kept. */
  closure: z.object({
    precipitationFactor: z.number(),
    profile: profileSchema,
    period: z.object({ from: z.string(), to: z.string() }).optional(),
    savedAt: z.string().optional(),
    savedBy: z.string().optional(),
    /** Inferred over station precipitation, catchment means. */
    ratio: z.number().optional(),
  }).nullable(),
  redistribution: redistributionSchema.nullable(),
  routing: routingSchema.nullable(),
  glacier: glacierSettingsSchema,
});
export type WaterInputs = z.output<typeof waterInputsSchema>;
