import { z } from 'zod';
import { PARAMETER_NAMES, PARAMETER_SPECS, type ParameterName } from './parameters';
import { isIsoDate, isTimeZone } from './calendar';
import { checkForcing } from './forcing-checks';
import { engineStateSchema } from './state-schema';
import { bandClimateSchema, checkWaterSide, redistributionSchema, routingSchema } from './water-side-schema';

const isoDate = z.string().refine(isIsoDate, { message: 'must be a real date written YYYY-MM-DD' });

/**
 * A forcing series of numbers; null marks a missing value, which is refused before simulating.
 * Checked in one pass that reports the first bad value with its index and how many there are,
 * instead of one issue per value (a year of hourly data can hold thousands).
 */
const series = (min: number, max: number, what: string) =>
  z.custom<(number | null)[]>((v) => Array.isArray(v) && v.length > 0, { message: 'must be a non-empty array of numbers (null for a missing value)' })
    .superRefine((values, ctx) => {
      let first = -1;
      let count = 0;
      for (let i = 0; i < values.length; i++) {
        const v = values[i];
        if (v === null || (typeof v === 'number' && v >= min && v <= max)) continue;
        if (first < 0) first = i;
        count++;
      }
      if (first >= 0) {
        ctx.addIssue({ code: 'custom', path: [first], message: `${String(values[first])} is not a ${what} between ${min} and ${max} (${count} such value(s) in this series)` });
      }
    });

/** A scenario value: one number for every month or twelve monthly values (January first). */
const monthly = (min: number, max: number) =>
  z.union([z.number().min(min).max(max), z.array(z.number().min(min).max(max)).length(12)]);

export const bandSchema = z.object({
  lowerM: z.number().min(-500).max(9000),
  upperM: z.number().min(-500).max(9000),
  areaKm2: z.number().positive().max(100_000),
  slopeDeg: z.number().min(0).max(89),
  aspectDeg: z.number().min(0).max(360),
  glacierFraction: z.number().min(0).max(1),
  /** Fraction of the glacier (not of the band) that is debris-covered. */
  debrisFraction: z.number().min(0).max(1),
  debrisThicknessM: z.number().min(0).max(10),
  /** Share of the sky hemisphere the band sees past the surrounding terrain (default (1 + cos β)/2). */
  skyViewFactor: z.number().min(0).max(1).optional(),
  /**
   * Terrain horizon: n azimuth sectors (8 … 72, sector k centred on k·360/n degrees clockwise from
   * north) × the horizon elevation in degrees at the 10th, 30th, 50th, 70th and 90th percentile of
   * the band's cells. See terrain.ts for how the sunlit share is read from it.
   */
  horizonDeg: z.array(z.array(z.number().min(-90).max(90)).length(5)).min(8).max(72).optional(),
}).refine((b) => b.upperM > b.lowerM, { path: ['upperM'], message: 'must be above lowerM' })
  .refine((b) => !b.horizonDeg || b.horizonDeg.every((q) => q.every((v, i) => i === 0 || v >= q[i - 1])), {
    path: ['horizonDeg'], message: 'horizon percentiles must not decrease within a sector',
  });

export const catchmentSchema = z.object({
  latitudeDeg: z.number().min(-90).max(90),
  longitudeDeg: z.number().min(-180).max(180),
  timeZone: z.string().refine(isTimeZone, { message: 'is not a known IANA time zone (e.g. Asia/Kathmandu)' }),
  stationElevationM: z.number().min(-500).max(9000),
  bands: z.array(bandSchema).min(1).max(500),
  /**
   * Impurities already in the catchment's snow today (the baseline's surface, not pristine
   * snow): concentration in fresh snowfall. A scenario's snow loads add to these.
   */
  background: z.object({
    blackCarbonSnowNgG: z.number().min(0).max(50_000).default(0),
    dustSnowUgG: z.number().min(0).max(5_000).default(0),
  }).optional(),
}).refine((c) => new Set(c.bands.filter((b) => b.horizonDeg).map((b) => b.horizonDeg!.length)).size <= 1, {
  path: ['bands'], message: 'every band with a terrain horizon must use the same number of azimuth sectors',
});

const optionalSeries = {
  precipitationStep: z.enum(['hourly', 'daily']).optional(),
  precipitationMm: series(0, 500, 'precipitation'),
  cloudiness: series(0, 1, 'cloudiness (fraction 0–1)').optional(),
  windMs: series(0, 60, 'wind speed').optional(),
  relativeHumidity: series(0, 1, 'relative humidity (a fraction 0–1; divide percent by 100)').optional(),
  /** Measured global radiation on the horizontal at the station, W m⁻² (mean of each step). */
  globalRadiationWm2: series(0, 1500, 'global radiation').optional(),
};

export const forcingSchema = z.discriminatedUnion('timeStep', [
  z.object({ timeStep: z.literal('hourly'), start: isoDate, temperatureC: series(-80, 60, 'temperature'), ...optionalSeries }),
  z.object({
    timeStep: z.literal('daily'),
    start: isoDate,
    tMinC: series(-80, 60, 'temperature'),
    tMaxC: series(-80, 60, 'temperature'),
    tMeanC: series(-80, 60, 'temperature').optional(),
    ...optionalSeries,
  }),
]);

export const parametersSchema = z.object(
  Object.fromEntries(PARAMETER_NAMES.map((name) => {
    const { min, max } = PARAMETER_SPECS[name];
    return [name, z.number().min(min).max(max).optional()];
  })) as Record<ParameterName, z.ZodOptional<z.ZodNumber>>,
).strict();

export const scenarioSchema = z.object({
  temperatureDeltaC: monthly(-15, 15).default(0),
  // Up to 20: a water-balance correction (up to 6, shared/hydrology) times a scenario's change.
  precipitationFactor: monthly(0, 20).default(1),
  blackCarbonSnowNgG: monthly(0, 50_000).default(0),
  blackCarbonIceNgG: monthly(0, 50_000).default(0),
  dustSnowUgG: monthly(0, 5_000).default(0),
  dustIceUgG: monthly(0, 5_000).default(0),
  /** Dry deposition of black carbon onto snow, µg m⁻² d⁻¹, added to what falls with the snow. */
  blackCarbonDepositionUgM2Day: monthly(0, 10_000).default(0),
  /** Dry deposition of dust onto snow, mg m⁻² d⁻¹. */
  dustDepositionMgM2Day: monthly(0, 10_000).default(0),
  /** Added to every band's debris thickness (m); results below the minimum thickness are raised to it. */
  debrisThicknessChangeM: z.number().min(-10).max(10).default(0),
  /** Fraction of each band's clean glacier area that becomes debris-covered. */
  debrisExtentChange: z.number().min(0).max(1).default(0),
}).strict();

/**
 * Impurity loads of one band where they differ from the scenario's (e.g. a dirtier tongue): each
 * field replaces the scenario's for that band; deposition rates stay catchment-wide.
 */
export const bandImpuritiesSchema = z.object({
  blackCarbonSnowNgG: monthly(0, 50_000).optional(),
  blackCarbonIceNgG: monthly(0, 50_000).optional(),
  dustSnowUgG: monthly(0, 5_000).optional(),
  dustIceUgG: monthly(0, 5_000).optional(),
}).strict();

/**
 * How a run starts. By default it first simulates a spin-up stretch of the record before the
 * period (see spin-up.ts) with the same scenario, and reports only the period. Alternatively the
 * snow water equivalent per band is given (measured, or from a snow survey), or the full state
 * another run ended with (for runs chained year by year).
 */
export const startSchema = z.discriminatedUnion('method', [
  z.object({ method: z.literal('spin-up'), years: z.number().int().min(1).max(5).default(1) }),
  z.object({ method: z.literal('initial-swe'), sweMm: z.array(z.number().min(0).max(1e6)) }),
  z.object({ method: z.literal('state'), state: engineStateSchema }),
]);

/** Where the shortwave comes from: 'auto' takes measured radiation, else cloudiness, else the daily temperature range. */
export const SHORTWAVE_SOURCES = ['measured', 'cloudiness', 'temperature-range', 'fixed-cloudiness'] as const;
export type ShortwaveSource = (typeof SHORTWAVE_SOURCES)[number];

export const simulationInputSchema = z.object({
  catchment: catchmentSchema,
  forcing: forcingSchema,
  parameters: parametersSchema.default({}),
  scenario: scenarioSchema.default({
    temperatureDeltaC: 0, precipitationFactor: 1, blackCarbonSnowNgG: 0, blackCarbonIceNgG: 0,
    dustSnowUgG: 0, dustIceUgG: 0, blackCarbonDepositionUgM2Day: 0, dustDepositionMgM2Day: 0,
    debrisThicknessChangeM: 0, debrisExtentChange: 0,
  }),
  start: startSchema.default({ method: 'spin-up', years: 1 }),
  /** Kept for callers of engine 1.x: the same as start { method: 'initial-swe' }. */
  initialState: z.object({ sweMm: z.array(z.number().min(0).max(1e6)) }).optional(),
  period: z.object({ from: isoDate, to: isoDate }).optional(),
  shortwaveSource: z.enum(['auto', ...SHORTWAVE_SOURCES]).default('auto'),
  physics: z.object({
    /**
     * Stability correction of the turbulent fluxes by the bulk Richardson number (turbulence.ts).
     * Off by default: over melting glaciers such corrections tend to shut down the exchange that
     * katabatic winds keep going, and several glacier energy-balance studies found their melt
     * better without them (e.g. Denby & Greuell 2000; Conway & Cullen 2013) [memory]; the neutral
     * exchange coefficient then stands for the effective one.
     */
    stabilityCorrection: z.boolean().default(false),
  }).default({ stabilityCorrection: false }),
  /** Per band: impurity loads that replace the scenario's (null: the scenario's). */
  impuritiesByBand: z.array(bandImpuritiesSchema.nullable()).optional(),
  /** Band temperature and precipitation from fitted vertical gradients (water-side-schema.ts). */
  bandClimate: bandClimateSchema.optional(),
  /** Snow redistribution between bands, once a day (water-side-schema.ts). */
  redistribution: redistributionSchema.optional(),
  /** Routing of the runoff to the outlet (water-side-schema.ts); absent: outlet discharge = the day's runoff. */
  routing: routingSchema.nullable().optional(),
}).superRefine((input, ctx) => {
  checkForcing(input, ctx);
  checkWaterSide(input, ctx);
});

export type SimulationInput = z.input<typeof simulationInputSchema>;
export type ParsedInput = z.output<typeof simulationInputSchema>;
export type Band = z.output<typeof bandSchema>;
export type Scenario = z.output<typeof scenarioSchema>;
export type Forcing = z.output<typeof forcingSchema>;
export type Start = z.output<typeof startSchema>;
export type BandImpurities = z.output<typeof bandImpuritiesSchema>;
