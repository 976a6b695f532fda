import { z } from 'zod';
import { PARAMETER_NAMES, PARAMETER_SPECS, type ParameterName } from '../melt/parameters';
import { daysBetween, isIsoDate } from '../melt/calendar';

/**
 * Version of the stored scenario-changes JSON; bump it (and migrate old rows) when its shape changes.
 * 2: impurity loads in snow are added to the catchment's background loads (concentration in fresh
 * snow), dry deposition rates join them, and the parameters retired with engine 2.0 are gone.
 */
export const SCENARIO_SCHEMA_VERSION = 2;

const number = (what: string, min: number, max: number, unit: string) =>
  z.number({ message: `must be a number (${what})` })
    .min(min, `must be at least ${min} ${unit}`.trim())
    .max(max, `must be at most ${max} ${unit}`.trim());

/** One value for every month, or twelve monthly values starting with January. */
const monthly = (what: string, min: number, max: number, unit: string) =>
  z.union([
    number(what, min, max, unit),
    z.array(number(what, min, max, unit), { message: `must be one number or 12 monthly numbers (${what})` })
      .length(12, 'must hold 12 monthly values, January first'),
  ], { message: `must be one number or 12 monthly numbers (${what})` });
export type MonthlyValue = number | number[];

const isoDate = z.string().refine(isIsoDate, { message: 'must be a real date written YYYY-MM-DD' });

export const periodSchema = z.object({ from: isoDate, to: isoDate })
  .refine((p) => p.from <= p.to, { path: ['to'], message: 'must not be before the start of the period' });

/** Model parameters a scenario overrides; each within the engine's published range. */
export const parameterOverridesSchema = z.object(
  Object.fromEntries(PARAMETER_NAMES.map((name) => {
    const { min, max, unit } = PARAMETER_SPECS[name];
    return [name, number(name, min, max, unit === '-' ? '' : unit).optional()];
  })) as Record<ParameterName, z.ZodOptional<z.ZodNumber>>,
).strict();
export type ParameterOverrides = z.infer<typeof parameterOverridesSchema>;

export const WARMING_LEVELS = ['1.5', '2', '3', '4'] as const;

/**
 * Impurity loads for the bands whose mean elevation lies in [fromM, toM); a load left out keeps
 * the scenario-wide value. Where ranges overlap, the first one listed applies.
 */
export const elevationRangeImpuritiesSchema = z.object({
  fromM: number('lower elevation of the range', -500, 9000, 'm'),
  toM: number('upper elevation of the range', -500, 9000, 'm'),
  blackCarbonSnowNgG: monthly('black carbon in snow', 0, 50_000, 'ng/g').optional(),
  blackCarbonIceNgG: monthly('black carbon on ice', 0, 50_000, 'ng/g').optional(),
  dustSnowUgG: monthly('dust in snow', 0, 5_000, 'µg/g').optional(),
  dustIceUgG: monthly('dust on ice', 0, 5_000, 'µg/g').optional(),
}).strict().refine((r) => r.toM > r.fromM, { path: ['toM'], message: 'must be above the lower elevation of the range' });
export type ElevationRangeImpurities = z.infer<typeof elevationRangeImpuritiesSchema>;
export const IMPURITY_FIELDS = ['blackCarbonSnowNgG', 'blackCarbonIceNgG', 'dustSnowUgG', 'dustIceUgG'] as const;

/**
 * The changes a scenario applies to the station record, stored as JSON with its schema version.
 * Maps onto the engine's scenario, parameters and period (see shared/analysis/engine-input.ts).
 */
export const scenarioChangesSchema = z.object({
  schemaVersion: z.literal(SCENARIO_SCHEMA_VERSION).default(SCENARIO_SCHEMA_VERSION),
  /** Simulated dates; null runs the whole climate record. */
  period: periodSchema.nullable().default(null),
  temperatureDeltaC: monthly('temperature change', -15, 15, '°C').default(0),
  /** The global warming level preset the temperature change started from, if any. */
  warmingLevel: z.enum(WARMING_LEVELS).nullable().default(null),
  precipitationFactor: monthly('precipitation factor', 0, 5, '').default(1),
  /**
   * Where precipitation comes from: the station record (× the factor above), or the catchment's
   * saved water-balance closure (its factor and profile, × the factor above as a change); null:
   * as the baseline (the baseline's null is the station's).
   */
  precipitationSource: z.enum(['station', 'water-balance'], { message: 'choose the station record or the water-balance precipitation' }).nullable().default(null),
  /** Added to the catchment's background black carbon in fresh snow, ng/g. */
  blackCarbonSnowNgG: monthly('black carbon in snow', 0, 50_000, 'ng/g').default(0),
  /** Added black carbon on bare ice, ng/g (the user-set ice darkening rule applies). */
  blackCarbonIceNgG: monthly('black carbon on ice', 0, 50_000, 'ng/g').default(0),
  dustSnowUgG: monthly('dust in snow', 0, 5_000, 'µg/g').default(0),
  dustIceUgG: monthly('dust on ice', 0, 5_000, 'µg/g').default(0),
  /** Dry deposition onto snow: black carbon µg m⁻² d⁻¹, dust mg m⁻² d⁻¹. */
  blackCarbonDepositionUgM2Day: monthly('black carbon deposition', 0, 10_000, 'µg/m²/day').default(0),
  dustDepositionMgM2Day: monthly('dust deposition', 0, 10_000, 'mg/m²/day').default(0),
  /** Loads that differ by elevation; bands outside every range keep the values above. */
  impuritiesByElevation: z.array(elevationRangeImpuritiesSchema).max(10, 'at most 10 elevation ranges').default([]),
  debrisThicknessChangeM: number('debris thickness change', -10, 10, 'm').default(0),
  debrisExtentChange: number('debris extent change', 0, 1, '(fraction of clean glacier area)').default(0),
  parameters: parameterOverridesSchema.default({}),
  /**
   * Stability correction of the turbulent fluxes over snow and ice (the engine's
   * physics.stabilityCorrection); null keeps the baseline's choice, which is off unless set.
   */
  stabilityCorrection: z.boolean().nullable().default(null),
}).strict();
export type ScenarioChanges = z.output<typeof scenarioChangesSchema>;
export type ScenarioChangesInput = z.input<typeof scenarioChangesSchema>;

/** The name of every catchment's baseline, made with the catchment; no variant may take it. */
export const BASELINE_NAME = 'Baseline';
/** Whether a name is the baseline's (compared as the database does: trimmed, any case). */
export const isReservedScenarioName = (name: string) => name.trim().toLowerCase() === BASELINE_NAME.toLowerCase();

const name = z.string().trim().min(1, 'is required').max(120, 'must be at most 120 characters');
const variantName = name.refine((n) => !isReservedScenarioName(n), { message: `"${BASELINE_NAME}" is the catchment's baseline; give the variant another name` });
const description = z.string().trim().max(2000, 'must be at most 2000 characters');

/** Name and description as the scenario builder's form edits them (the baseline keeps its name). */
export const scenarioFieldsSchema = z.object({ name, description });

export const scenarioCreateSchema = z.object({
  name: variantName,
  description: description.default(''),
  changes: scenarioChangesSchema,
});
export type ScenarioCreate = z.input<typeof scenarioCreateSchema>;

export const scenarioUpdateSchema = z.object({
  name: variantName.optional(),
  description: description.optional(),
  changes: scenarioChangesSchema.optional(),
  archived: z.boolean().optional(),
}).strict();
export type ScenarioUpdate = z.input<typeof scenarioUpdateSchema>;

export const scenarioSchema = z.object({
  id: z.number().int(),
  catchmentId: z.number().int(),
  name: z.string(),
  description: z.string(),
  isBaseline: z.boolean(),
  archived: z.boolean(),
  changes: scenarioChangesSchema,
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type ScenarioRecord = z.infer<typeof scenarioSchema>;

export const scenarioListSchema = z.object({ scenarios: z.array(scenarioSchema) });
export const scenarioReplySchema = z.object({ scenario: scenarioSchema });

export const scenarioSetupSchema = z.object({
  record: z.object({ from: z.string(), to: z.string() }).nullable(),
  defaultPeriod: z.object({ from: z.string(), to: z.string() }).nullable(),
  /** The catchment's newest saved calibration, which new scenarios start from; null when none was saved. */
  calibration: z.object({
    parameters: z.record(z.string(), z.number()),
    precipitationFactor: z.number(),
    savedBy: z.string(),
    savedAt: z.string(),
  }).nullable(),
  /** The catchment's background loads in fresh snow, which a scenario's snow loads add to. */
  background: z.object({ blackCarbonSnowNgG: z.number(), dustSnowUgG: z.number() }),
  /** The kept water-balance closure a scenario may take its precipitation from; null when none is kept. */
  waterBalance: z.object({
    precipitationFactor: z.number(), ratio: z.number(), period: z.object({ from: z.string(), to: z.string() }), savedBy: z.string(), savedAt: z.string(),
  }).nullable().default(null),
});
export type ScenarioSetup = z.infer<typeof scenarioSetupSchema>;

/** GET …/scenarios?archived=true|false */
export const scenarioListQuerySchema = z.object({ archived: z.enum(['true', 'false']).default('false').transform((v) => v === 'true') });

/** GET …/preview-input?from&to: the preview simulates one band in the browser; a year at most keeps the download small. */
export const previewPeriodSchema = periodSchema.refine((p) => daysBetween(p.from, p.to) <= 366, { path: ['to'], message: 'the preview covers at most one year' });
