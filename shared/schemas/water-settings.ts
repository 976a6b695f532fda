import { z } from 'zod';
import type { ParameterSpec } from '../melt/parameters';
import { AVALANCHE_PARAMETERS } from '../hydrology/avalanche';
import { WIND_FACTOR } from '../hydrology/wind-drift';
import { ROUTING_PARAMETERS } from '../hydrology/runoff-routing';
import { GLACIER_DAMPING_PARAMETERS } from '../hydrology/glacier-air-temperature';
import { PROFILE_PARAMETERS } from '../hydrology/precipitation-profile';
import { VOLUME_AREA } from '../hydrology/glacier-volume';

/**
 * How a catchment's water side is simulated, stored as versioned JSON per catchment: the
 * vertical gradients taken from its stations, snow redistribution between bands, routing of the
 * runoff to the outlet and the glacier a multi-decade run starts from. Everything defaults to
 * what Tarnish did before: the engine's own lapse rate and gradient, nothing moved, no routing.
 */
export const WATER_SETTINGS_VERSION = 1;

const ranged = (spec: ParameterSpec, what: string) =>
  z.number({ message: `must be a number (${what})` }).min(spec.min, `must be at least ${spec.min} (${what})`).max(spec.max, `must be at most ${spec.max} (${what})`);

function overrides<T extends Record<string, ParameterSpec>>(specs: T) {
  return z.object(Object.fromEntries(Object.entries(specs).map(([key, spec]) => [key, ranged(spec, key).optional()])) as Record<keyof T, z.ZodOptional<z.ZodNumber>>).strict();
}

const profileSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('linear'), gradientPerKm: ranged(PROFILE_PARAMETERS.gradientPerKm, 'precipitation gradient') }),
  z.object({
    kind: z.literal('peaked'),
    peakElevationM: ranged(PROFILE_PARAMETERS.peakElevationM, 'peak elevation'),
    gradientBelowPerKm: ranged(PROFILE_PARAMETERS.gradientBelowPerKm, 'gradient below the peak'),
    decreaseAbovePerKm: ranged(PROFILE_PARAMETERS.decreaseAbovePerKm, 'decrease above the peak'),
  }),
], { message: 'a precipitation profile is linear or peaked' });
export type ProfileSetting = z.infer<typeof profileSchema>;

const twelve = <T extends z.ZodType>(item: T) => z.array(item.nullable()).length(12, 'must hold 12 monthly values, January first (empty for months kept as fitted)');
const emptyMonths = () => Array<null>(12).fill(null);

/** Lapse rates outside −15 … +10 K km⁻¹ are refused; strong winter inversions reach positive values. */
const lapseRate = z.number({ message: 'must be a number (K per km)' }).min(-15, 'must be at least −15 K per km').max(10, 'must be at most +10 K per km');

export const gradientSettingsSchema = z.object({
  /** Take band temperature and precipitation from these gradients (instead of the engine's lapse rate and gradient). */
  use: z.boolean().default(false),
  precipitationForm: z.enum(['linear', 'peaked']).default('linear'),
  /** Fit the profile month by month; otherwise once on the stations' annual totals (the usual choice for the peaked form). */
  perMonth: z.boolean().default(false),
  /** For months with fewer than two stations; −6.5 K km⁻¹ is the ICAO standard atmosphere. */
  assumedLapseRateKPerKm: lapseRate.default(-6.5),
  assumedGradientPerKm: ranged(PROFILE_PARAMETERS.gradientPerKm, 'assumed precipitation gradient').default(PROFILE_PARAMETERS.gradientPerKm.default),
  /** Peaked-profile parameters held fixed in the fit (the rest are fitted). */
  fixed: z.object({
    peakElevationM: ranged(PROFILE_PARAMETERS.peakElevationM, 'peak elevation').optional(),
    gradientBelowPerKm: ranged(PROFILE_PARAMETERS.gradientBelowPerKm, 'gradient below the peak').optional(),
    decreaseAbovePerKm: ranged(PROFILE_PARAMETERS.decreaseAbovePerKm, 'decrease above the peak').optional(),
  }).strict().default({}),
  /** On-glacier temperature damping (Greuell & Böhm 1998); null: off. */
  damping: overrides(GLACIER_DAMPING_PARAMETERS).required().nullable().default(null),
  /** Months set by hand (null: keep the fitted or assumed value). */
  overrides: z.object({
    lapseRatesKPerKm: twelve(lapseRate).default(emptyMonths),
    profiles: twelve(profileSchema).default(emptyMonths),
  }).default({ lapseRatesKPerKm: emptyMonths(), profiles: emptyMonths() }),
});
export type GradientSettings = z.output<typeof gradientSettingsSchema>;

export const redistributionSettingsSchema = z.object({
  /** Avalanching after Bernhardt & Schulz 2010; null: off. */
  avalanche: z.object({ parameters: overrides(AVALANCHE_PARAMETERS).default({}) }).nullable().default(null),
  /** Wind drift of snowfall by a factor per band (1 keeps its own snowfall); null: off. */
  windDrift: z.object({ factors: z.array(ranged(WIND_FACTOR, 'accumulation factor')).min(1).max(500) }).nullable().default(null),
});

export const glacierSettingsSchema = z.discriminatedUnion('method', [
  z.object({
    method: z.literal('volume-area'),
    /** Areas of the catchment's individual glaciers, km²; null: one glacier of the bands' total. */
    glacierAreasKm2: z.array(z.number().positive('every glacier needs an area above 0 km²')).min(1).max(200).nullable().default(null),
    coefficientKm: ranged(VOLUME_AREA.coefficientKm, 'volume–area coefficient').default(VOLUME_AREA.coefficientKm.default),
    exponent: ranged(VOLUME_AREA.exponent, 'volume–area exponent').default(VOLUME_AREA.exponent.default),
  }),
  z.object({
    method: z.literal('thickness'),
    /** Mean ice thickness per band, m (0 for bands without glacier). */
    iceThicknessM: z.array(z.number().min(0, 'must not be negative').max(2000, 'must be at most 2000 m')).min(1).max(500),
  }),
], { message: 'choose the volume–area relation or an ice thickness per band' });
export type GlacierSettings = z.output<typeof glacierSettingsSchema>;

export const waterSettingsSchema = z.object({
  version: z.literal(WATER_SETTINGS_VERSION).default(WATER_SETTINGS_VERSION),
  gradients: gradientSettingsSchema.default(() => gradientSettingsSchema.parse({})),
  redistribution: redistributionSettingsSchema.default({ avalanche: null, windDrift: null }),
  /** Linear-reservoir routing to the outlet (Hock & Noetzli 1997); null: the outlet discharge is the day's runoff. */
  routing: z.object({ parameters: overrides(ROUTING_PARAMETERS).default({}) }).nullable().default(null),
  glacier: glacierSettingsSchema.default({ method: 'volume-area', glacierAreasKm2: null, coefficientKm: VOLUME_AREA.coefficientKm.default, exponent: VOLUME_AREA.exponent.default }),
});
export type WaterSettings = z.output<typeof waterSettingsSchema>;
export type WaterSettingsInput = z.input<typeof waterSettingsSchema>;
export const DEFAULT_WATER_SETTINGS: WaterSettings = waterSettingsSchema.parse({});

export const waterSettingsReplySchema = z.object({
  settings: waterSettingsSchema,
  updatedAt: z.string().nullable(),
  updatedBy: z.string().nullable(),
});
export type WaterSettingsReply = z.infer<typeof waterSettingsReplySchema>;
