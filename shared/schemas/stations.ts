import { z } from 'zod';
import { VARIABLES, type Variable } from './dataset-variables';

const trimmed = (max: number) => z.string().trim().max(max, `must be at most ${max} characters`);
const CLIMATE_VARIABLES = (Object.keys(VARIABLES) as Variable[]).filter((v) => VARIABLES[v].kind === 'climate');

/** What the station's network states about one variable's accuracy, in its own words (e.g. "±0.2 °C"). */
export const stationAccuracySchema = z.object({
  variable: z.enum(CLIMATE_VARIABLES as [Variable, ...Variable[]], { message: 'choose one of the climate variables' }),
  statement: trimmed(200).min(1, 'is required (e.g. ±0.2 °C, or "not stated by the operator")'),
});

/**
 * A weather station of a catchment as the consultant enters it. Stations in high mountains are
 * run by different networks with different instruments, so each keeps who runs it, what it
 * measures with, the accuracy its operator states per variable and the licence its data come under.
 */
export const stationFormSchema = z.object({
  name: trimmed(120).min(1, 'is required'),
  network: trimmed(120).default(''),
  instrument: trimmed(200).default(''),
  elevationM: z.number({ message: 'must be a number' }).min(-500, 'must be between −500 and 9000 m').max(9000, 'must be between −500 and 9000 m'),
  latitudeDeg: z.number({ message: 'must be a number' }).min(-90, 'must be between −90 and 90').max(90, 'must be between −90 and 90').nullable().default(null),
  longitudeDeg: z.number({ message: 'must be a number' }).min(-180, 'must be between −180 and 180').max(180, 'must be between −180 and 180').nullable().default(null),
  accuracy: z.array(stationAccuracySchema).max(10, 'at most one statement per variable').default([])
    .refine((list) => new Set(list.map((a) => a.variable)).size === list.length, { message: 'give each variable’s accuracy once' }),
  licence: trimmed(500).default(''),
}).refine((s) => (s.latitudeDeg === null) === (s.longitudeDeg === null), { path: ['longitudeDeg'], message: 'give both latitude and longitude, or neither' });
export type StationForm = z.input<typeof stationFormSchema>;
export type StationFields = z.output<typeof stationFormSchema>;

export const stationSchema = z.object({
  id: z.number().int(),
  catchmentId: z.number().int(),
  name: z.string(),
  network: z.string(),
  instrument: z.string(),
  elevationM: z.number(),
  latitudeDeg: z.number().nullable(),
  longitudeDeg: z.number().nullable(),
  accuracy: z.array(z.object({ variable: z.string(), statement: z.string() })),
  licence: z.string(),
  /** The station whose series drive the engine (the catchment's station). */
  isReference: z.boolean(),
  datasetCount: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Station = z.infer<typeof stationSchema>;
export const stationListSchema = z.object({ stations: z.array(stationSchema) });
export const stationReplySchema = z.object({ station: stationSchema });

/** PUT …/datasets/:datasetId/station: which station a dataset belongs to (null: none, for observations only). */
export const datasetStationSchema = z.object({ stationId: z.number({ message: 'choose a station' }).int().positive().nullable() });

/** GET …/stations/compare?first=&second=: two records of one variable. */
export const stationComparisonQuerySchema = z.object({
  first: z.coerce.number({ message: 'choose the first record' }).int().positive(),
  second: z.coerce.number({ message: 'choose the second record' }).int().positive(),
}).refine((q) => q.first !== q.second, { path: ['second'], message: 'choose two different records' });

const recordSchema = z.object({ datasetId: z.number().int(), stationName: z.string(), network: z.string(), source: z.string(), accuracy: z.string(), first: z.string().nullable(), last: z.string().nullable() });

/**
 * Two overlapping records compared day by day over their common period, without merging them:
 * bias (second minus first), correlation, root-mean-square difference and the means.
 */
export const stationComparisonSchema = z.object({
  variable: z.string(),
  variableLabel: z.string(),
  unit: z.string(),
  /** Daily means, or daily totals for precipitation. */
  statistic: z.enum(['mean', 'total']),
  first: recordSchema,
  second: recordSchema,
  commonPeriod: z.object({ from: z.string(), to: z.string() }).nullable(),
  days: z.number().int(),
  meanFirst: z.number().nullable(),
  meanSecond: z.number().nullable(),
  /** Mean of second − first over the common days. */
  bias: z.number().nullable(),
  /** Pearson correlation of the daily values; null with fewer than three days or a series that does not vary. */
  correlation: z.number().nullable(),
  rmsDifference: z.number().nullable(),
  dates: z.array(z.string()),
  firstValues: z.array(z.number()),
  secondValues: z.array(z.number()),
  notes: z.array(z.string()),
});
export type StationComparison = z.infer<typeof stationComparisonSchema>;
