import { z } from 'zod';
import { PARAMETER_NAMES, PARAMETER_SPECS, type ParameterName } from './parameters';
import { isIsoDate, isTimeZone } from './calendar';
import { checkForcing } from './forcing-checks';

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
}).refine((b) => b.upperM > b.lowerM, { path: ['upperM'], message: 'must be above lowerM' });

export const catchmentSchema = z.object({
  latitudeDeg: z.number().min(-90).max(90),
  longitudeDeg: z.number().min(-180).max(180),
  timeZone: z.string().refine(isTimeZone, { message: 'is not a known IANA time zone (e.g. Asia/Kathmandu)' }),
  stationElevationM: z.number().min(-500).max(9000),
  bands: z.array(bandSchema).min(1).max(500),
});

const optionalSeries = {
  precipitationStep: z.enum(['hourly', 'daily']).optional(),
  precipitationMm: series(0, 500, 'precipitation'),
  cloudiness: series(0, 1, 'cloudiness (fraction 0–1)').optional(),
  windMs: series(0, 60, 'wind speed').optional(),
  relativeHumidity: series(0, 1, 'relative humidity (a fraction 0–1; divide percent by 100)').optional(),
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
  precipitationFactor: monthly(0, 5).default(1),
  blackCarbonSnowNgG: monthly(0, 50_000).default(0),
  blackCarbonIceNgG: monthly(0, 50_000).default(0),
  dustSnowUgG: monthly(0, 5_000).default(0),
  dustIceUgG: monthly(0, 5_000).default(0),
  /** Added to every band's debris thickness (m); results below the minimum thickness are raised to it. */
  debrisThicknessChangeM: z.number().min(-10).max(10).default(0),
  /** Fraction of each band's clean glacier area that becomes debris-covered. */
  debrisExtentChange: z.number().min(0).max(1).default(0),
}).strict();

export const simulationInputSchema = z.object({
  catchment: catchmentSchema,
  forcing: forcingSchema,
  parameters: parametersSchema.default({}),
  scenario: scenarioSchema.default({
    temperatureDeltaC: 0, precipitationFactor: 1, blackCarbonSnowNgG: 0, blackCarbonIceNgG: 0,
    dustSnowUgG: 0, dustIceUgG: 0, debrisThicknessChangeM: 0, debrisExtentChange: 0,
  }),
  initialState: z.object({ sweMm: z.array(z.number().min(0).max(1e6)) }).optional(),
  period: z.object({ from: isoDate, to: isoDate }).optional(),
}).superRefine(checkForcing);

export type SimulationInput = z.input<typeof simulationInputSchema>;
export type ParsedInput = z.output<typeof simulationInputSchema>;
export type Band = z.output<typeof bandSchema>;
export type Scenario = z.output<typeof scenarioSchema>;
export type Forcing = z.output<typeof forcingSchema>;
