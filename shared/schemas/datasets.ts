import { z } from 'zod';
import { isTimeZone } from '../melt/calendar';
import { VARIABLE_NAMES, type Variable } from './dataset-variables';

export const variableSchema = z.enum(VARIABLE_NAMES as [Variable, ...Variable[]]);
export const timeStepSchema = z.enum(['hourly', 'daily']);

/** The form fields sent beside an uploaded series file. */
export const datasetUploadFieldsSchema = z.object({
  variable: variableSchema,
  /** Leave empty to take the unit from the column header (or the variable's usual unit, said so in the preview). */
  unit: z.string().trim().max(20).optional().transform((v) => v || undefined),
  /** Leave empty to detect it from the timestamps. */
  timeStep: z.union([timeStepSchema, z.literal('')]).optional().transform((v) => v || undefined),
  timeZone: z.string().trim().min(1, 'is required').refine(isTimeZone, { message: 'is not a known IANA time zone (e.g. Asia/Kathmandu)' }),
  source: z.string().trim().min(1, 'is required (who measured it, which station or product)').max(300),
  accuracy: z.string().trim().max(200).default(''),
  /** The station that recorded the series; empty: the catchment's reference station for climate series, none for observations. */
  stationId: z.union([z.coerce.number().int().positive(), z.literal('')]).optional().transform((v) => (v === '' ? undefined : v)),
});
export type DatasetUploadFields = z.input<typeof datasetUploadFieldsSchema>;

export const PROBLEM_KINDS = [
  'unreadable_date', 'out_of_order', 'duplicate', 'gap', 'missing_value', 'not_a_number', 'implausible', 'step_mismatch',
] as const;
export const problemSchema = z.object({
  kind: z.enum(PROBLEM_KINDS),
  /** 'error' stops the import; 'warning' is stored as it is (gaps stay gaps). */
  severity: z.enum(['error', 'warning']),
  /** Line in the file (the header is line 1); 0 when the problem is about the whole file. */
  row: z.number().int(),
  column: z.string(),
  message: z.string(),
});
export type Problem = z.infer<typeof problemSchema>;

export const uploadPreviewSchema = z.object({
  token: z.string(),
  expiresAt: z.string(),
  fileName: z.string(),
  variable: variableSchema,
  unit: z.string(),
  storedUnit: z.string(),
  unitNote: z.string(),
  timeStep: timeStepSchema,
  timeStepNote: z.string(),
  delimiter: z.string(),
  decimalComma: z.boolean(),
  columns: z.array(z.object({ name: z.string(), role: z.enum(['time', 'value', 'ignored']) })),
  firstRows: z.array(z.object({ row: z.number().int(), time: z.string(), value: z.number().nullable() })),
  rowCount: z.number().int(),
  valueCount: z.number().int(),
  first: z.string().nullable(),
  last: z.string().nullable(),
  problems: z.array(problemSchema),
  /** Counts per kind, including problems beyond the listed ones. */
  problemCounts: z.record(z.string(), z.number().int()),
  canConfirm: z.boolean(),
});
export type UploadPreview = z.infer<typeof uploadPreviewSchema>;

export const datasetSchema = z.object({
  id: z.number().int(),
  catchmentId: z.number().int(),
  /** The station that recorded it; null for observations that belong to no station (e.g. the outlet gauge). */
  stationId: z.number().int().nullable(),
  stationName: z.string().nullable(),
  variable: variableSchema,
  kind: z.enum(['climate', 'observation']),
  unit: z.string(),
  originalUnit: z.string(),
  timeStep: timeStepSchema,
  timeZone: z.string(),
  source: z.string(),
  accuracy: z.string(),
  fileName: z.string(),
  uploadedBy: z.string(),
  createdAt: z.string(),
  first: z.string().nullable(),
  last: z.string().nullable(),
  valueCount: z.number().int(),
  /** Share of the steps between first and last that hold a value, 0–1. */
  completeness: z.number(),
});
export type Dataset = z.infer<typeof datasetSchema>;

export const datasetListSchema = z.object({ datasets: z.array(datasetSchema) });
export const datasetReplySchema = z.object({ dataset: datasetSchema });

/** A series for charts: one timestamp per step from first to last, null where a value is missing. */
export const seriesSchema = z.object({
  dataset: datasetSchema,
  times: z.array(z.string()),
  values: z.array(z.number().nullable()),
});
export type Series = z.infer<typeof seriesSchema>;

export const monthlySummarySchema = z.object({
  months: z.array(z.object({
    month: z.string(),
    /** Mean for temperature-like series, total for precipitation; null when the month has no values. */
    value: z.number().nullable(),
    statistic: z.enum(['mean', 'total']),
    count: z.number().int(),
    expected: z.number().int(),
    completeness: z.number(),
  })),
});
export type MonthlySummary = z.infer<typeof monthlySummarySchema>;
