import { z } from 'zod';
import { deriveRequestSchema, uploadSummarySchema } from './geodata';

/** Multipart text fields arrive as text: numbers and switches are read from it first, so the JSON derive schema checks them. */
const fromFormText = (raw: unknown) => {
  if (typeof raw !== 'object' || raw === null) return raw;
  const out: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(raw)) {
    if (typeof value !== 'string' || key === 'verticalUnit') out[key] = value;
    else if (value.trim() === '') continue;
    else if (value === 'true' || value === 'false') out[key] = value === 'true';
    else out[key] = Number.isFinite(Number(value)) ? Number(value) : value;
  }
  return out;
};

/**
 * The form sent with many outlines over one DEM: how the bands are derived (as for one catchment),
 * the catchment whose station record the new catchments use (a regional station, as for a
 * catchment table), and the DEM's vertical unit when the file does not say it.
 */
export const outlineBatchFieldsSchema = z.preprocess(fromFormText, deriveRequestSchema.extend({
  climateFromCatchmentId: z.number({ message: 'choose the catchment whose station record the new ones use' }).int().positive(),
  verticalUnit: z.enum(['', 'metre', 'foot', 'us-foot']).default(''),
}).strict());
export type OutlineBatchFields = z.output<typeof outlineBatchFieldsSchema>;

/** The layers of such an upload, as multipart file fields: the DEM and the catchment outlines, glacier and debris outlines optional. */
export const OUTLINE_BATCH_LAYERS = ['dem', 'catchmentOutline', 'glacierOutline', 'debrisOutline'] as const;
export type OutlineBatchLayer = (typeof OUTLINE_BATCH_LAYERS)[number];

/**
 * The attributes a feature's name is read from, in this order, whatever their letter case
 * (shapefile attributes are often upper case: NAME, CATCHMENT).
 */
export const NAME_ATTRIBUTES = ['name', 'catchment', 'catchment_name'] as const;
/** Longest catchment name (as the catchment form allows). */
export const MAX_NAME_LENGTH = 120;
/** Most outlines one file may hold: one upload makes at most this many catchments. */
export const MAX_OUTLINE_FEATURES = 200;

/** One outline of the file, as the preview shows it. */
export const batchOutlineSchema = z.object({
  /** Position in the file, from 1. */
  feature: z.number().int(),
  name: z.string().nullable(),
  /** Waiting to be derived, derived, or not derivable (its problems say why). */
  state: z.enum(['waiting', 'derived', 'refused']),
  areaKm2: z.number().nullable(),
  minElevationM: z.number().nullable(),
  maxElevationM: z.number().nullable(),
  bandCount: z.number().int().nullable(),
  glacierAreaKm2: z.number().nullable(),
  /** What stops this outline becoming a catchment, in words (without the feature's number and name). */
  problems: z.array(z.string()),
  /** Doubtful but usable, in words. */
  notices: z.array(z.string()),
});
export type BatchOutline = z.infer<typeof batchOutlineSchema>;

const fileSchema = z.object({ fileName: z.string(), byteSize: z.number(), summary: uploadSummarySchema });

export const outlineBatchSchema = z.object({
  token: z.string(),
  status: z.enum(['reading', 'ready', 'failed']),
  /** Why reading stopped (status failed). */
  error: z.string().nullable(),
  files: z.object({ dem: fileSchema, catchmentOutline: fileSchema, glacierOutline: fileSchema.optional(), debrisOutline: fileSchema.optional() }),
  options: z.object({ climateFromCatchmentId: z.number().int(), bandWidthM: z.number(), splitByAspect: z.boolean(), horizonSectors: z.number(), debrisThicknessM: z.number().optional() }),
  outlineCount: z.number().int(),
  derivedCount: z.number().int(),
  outlines: z.array(batchOutlineSchema),
  /** Every outline derived without a problem, nothing made yet: confirming makes them all. */
  canConfirm: z.boolean(),
  expiresAt: z.string(),
});
export type OutlineBatch = z.infer<typeof outlineBatchSchema>;
export const outlineBatchReplySchema = z.object({ batch: outlineBatchSchema });
