import { z } from 'zod';
import { catchmentFormSchema } from './catchments';
import { checkMultiDecadeOptions, runOptionsSchema } from './runs';
import { isReservedScenarioName, scenarioChangesSchema, BASELINE_NAME } from './scenarios';

const name = z.string().trim().min(1, 'is required').max(80, 'must be at most 80 characters');

/**
 * What every run of a study shares: a run's options without its scenario — the templates' season,
 * or multi-decade years (`transient`), whose regional totals are then by year instead of by month.
 */
export const studyOptionsSchema = runOptionsSchema.superRefine(checkMultiDecadeOptions);
export type StudyOptions = z.output<typeof studyOptionsSchema>;

/** The values a template may set differently for one catchment (catchment-wide numbers). */
export const STUDY_VALUE_FIELDS = [
  { field: 'blackCarbonSnowNgG', label: 'Black carbon in snow', unit: 'ng/g', min: 0, max: 50_000 },
  { field: 'blackCarbonIceNgG', label: 'Black carbon on ice', unit: 'ng/g', min: 0, max: 50_000 },
  { field: 'dustSnowUgG', label: 'Dust in snow', unit: 'µg/g', min: 0, max: 5_000 },
  { field: 'dustIceUgG', label: 'Dust on ice', unit: 'µg/g', min: 0, max: 5_000 },
  { field: 'temperatureDeltaC', label: 'Temperature change', unit: '°C', min: -15, max: 15 },
  { field: 'debrisThicknessChangeM', label: 'Debris thickness change', unit: 'm', min: -10, max: 10 },
] as const;
export type StudyValueField = (typeof STUDY_VALUE_FIELDS)[number]['field'];

const valueNumber = (label: string, unit: string, min: number, max: number) =>
  z.number({ message: 'must be a number' }).min(min, `${label} must be at least ${min} ${unit}`).max(max, `${label} must be at most ${max} ${unit}`).optional();

/** One catchment's own values for a template: only those given replace the template's. */
export const studyValueSchema = z.object({
  catchmentId: z.number().int().positive(),
  ...Object.fromEntries(STUDY_VALUE_FIELDS.map((f) => [f.field, valueNumber(f.label, f.unit, f.min, f.max)])) as Record<StudyValueField, ReturnType<typeof valueNumber>>,
}).strict();
export type StudyValue = z.output<typeof studyValueSchema>;

/** A scenario template: the changes applied to every catchment of the study, with per-catchment values. */
export const studyTemplateSchema = z.object({
  name: name.refine((n) => !isReservedScenarioName(n), { message: `"${BASELINE_NAME}" is each catchment's own baseline; name the variant otherwise` }),
  changes: scenarioChangesSchema,
  values: z.array(studyValueSchema).max(1000).default([]),
});
export type StudyTemplateInput = z.input<typeof studyTemplateSchema>;

export const studyCreateSchema = z.object({
  name,
  description: z.string().trim().max(2000, 'must be at most 2000 characters').default(''),
  catchmentIds: z.array(z.number().int().positive()).min(1, 'choose at least one catchment').max(500, 'at most 500 catchments')
    .refine((ids) => new Set(ids).size === ids.length, { message: 'choose each catchment once' }),
  templates: z.array(studyTemplateSchema).min(1, 'give at least one variant').max(10, 'at most 10 variants')
    .refine((ts) => new Set(ts.map((t) => t.name.toLowerCase())).size === ts.length, { message: 'give each variant its own name' }),
  options: studyOptionsSchema.default(studyOptionsSchema.parse({})),
}).strict();
export type StudyCreate = z.input<typeof studyCreateSchema>;

/**
 * A catchment table: one row per elevation band, each naming its catchment, which the rows of one
 * catchment repeat (name, latitudeDeg, longitudeDeg, timeZone, stationName, stationElevationM, then
 * the band columns of a band table). The catchments of a region are made from it in one upload.
 */
export const CATCHMENT_TABLE_COLUMNS = ['name', 'latitudeDeg', 'longitudeDeg', 'timeZone', 'stationName', 'stationElevationM', 'lowerM', 'upperM', 'areaKm2', 'slopeDeg', 'aspectDeg', 'glacierFraction', 'debrisFraction', 'debrisThicknessM'] as const;
export const catchmentTableCatchmentSchema = catchmentFormSchema.pick({
  name: true, latitudeDeg: true, longitudeDeg: true, timeZone: true, stationName: true, stationElevationM: true,
});

export const catchmentTableSchema = z.object({
  rows: z.array(z.record(z.string(), z.unknown())).min(1, 'the table has no rows').max(5_000, 'at most 5,000 rows (one upload)'),
  /** The catchment whose station record the new catchments use (a regional station). */
  climateFromCatchmentId: z.number({ message: 'choose the catchment whose station record the new ones use' }).int().positive(),
}).strict();

export const CELL_STATUSES = ['waiting', 'running', 'done', 'failed', 'cancelled'] as const;
export type CellStatus = (typeof CELL_STATUSES)[number];

const cellSchema = z.object({
  templateId: z.number().int(),
  runId: z.number().int().nullable(),
  status: z.enum(CELL_STATUSES),
  progress: z.number(),
  message: z.string().nullable(),
});

/** Where one catchment of a study stands: the worst of its runs (failed, then running, then waiting). */
export const studyCatchmentSchema = z.object({
  catchmentId: z.number().int(),
  name: z.string(),
  status: z.enum(CELL_STATUSES),
  message: z.string().nullable(),
  progress: z.number(),
  cells: z.array(cellSchema),
});
export type StudyCatchment = z.infer<typeof studyCatchmentSchema>;

export const STUDY_STATUSES = ['draft', 'waiting', 'running', 'done', 'failed', 'cancelled'] as const;

export const studySchema = z.object({
  id: z.number().int(),
  name: z.string(),
  description: z.string(),
  status: z.enum(STUDY_STATUSES),
  options: studyOptionsSchema,
  templates: z.array(z.object({ id: z.number().int(), name: z.string(), changes: scenarioChangesSchema, values: z.array(studyValueSchema) })),
  catchments: z.array(studyCatchmentSchema),
  counts: z.object({ done: z.number().int(), running: z.number().int(), waiting: z.number().int(), failed: z.number().int(), cancelled: z.number().int() }),
  progress: z.number(),
  createdAt: z.string(),
  startedAt: z.string().nullable(),
});
export type Study = z.infer<typeof studySchema>;
export const studyReplySchema = z.object({ study: studySchema });

export const studyListItemSchema = studySchema.pick({ id: true, name: true, description: true, status: true, progress: true, counts: true, createdAt: true, startedAt: true })
  .extend({ catchmentCount: z.number().int(), templateCount: z.number().int() });
export type StudyListItem = z.infer<typeof studyListItemSchema>;
export const studyListSchema = z.object({ studies: z.array(studyListItemSchema) });

const range = z.object({ p5: z.number(), p50: z.number(), p95: z.number() }).nullable();

/** One catchment's added melt in a regional result (variant minus its paired baseline). */
export const regionalCatchmentSchema = z.object({
  catchmentId: z.number().int(),
  name: z.string(),
  runId: z.number().int(),
  rank: z.number().int(),
  addedVolumeM3: z.number(),
  meanAddedDischargeM3s: z.number(),
  addedDepthMm: z.number(),
  areaKm2: z.number(),
  /** 5–95 % of the added volume over the run's ensemble; null without one. */
  addedVolumeRangeM3: range,
  /** Added runoff in each of the template's `periods`, m³. */
  addedByPeriodM3: z.array(z.number()),
});
export type RegionalCatchment = z.infer<typeof regionalCatchmentSchema>;

export const regionalTemplateSchema = z.object({
  templateId: z.number().int(),
  name: z.string(),
  /** Calendar months ("2024-05") of season runs, or years ("2031") of multi-decade runs: see the result's `step`. */
  periods: z.array(z.string()),
  /** Ranked by added volume, largest first. */
  catchments: z.array(regionalCatchmentSchema),
  addedByPeriodM3: z.array(z.number()),
  total: z.object({
    addedVolumeM3: z.number(),
    meanAddedDischargeM3s: z.number(),
    /** 5–95 % of the regional sum over the ensemble members (same parameter sets in every catchment); null without one. */
    addedVolumeRangeM3: range,
    meanAddedDischargeRangeM3s: range,
  }),
});
export type RegionalTemplate = z.infer<typeof regionalTemplateSchema>;

export const regionalResultsSchema = z.object({
  study: z.object({ id: z.number().int(), name: z.string() }),
  /** Catchments with every run done, of all in the study. */
  complete: z.object({ done: z.number().int(), of: z.number().int() }),
  /** Season runs add up by month, multi-decade runs by year (mean added discharge then over all the run's years). */
  step: z.enum(['month', 'year']),
  templates: z.array(regionalTemplateSchema),
  cautions: z.array(z.string()),
});
export type RegionalResults = z.infer<typeof regionalResultsSchema>;
/** The axis of a regional result over time, by its step. */
export const PERIOD_NAMES: Record<RegionalResults['step'], string> = { month: 'Month', year: 'Year' };
export const regionalResultsReplySchema = z.object({ results: regionalResultsSchema });

export const bulkCatchmentsReplySchema = z.object({ study: studySchema, created: z.array(z.object({ id: z.number().int(), name: z.string() })) });
