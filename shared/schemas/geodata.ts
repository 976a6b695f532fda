import { z } from 'zod';
import { isIsoDate } from '../melt/calendar';
import { bandRowSchema } from './catchment-bands';

/** What a geodata file is to the catchment. */
export const GEODATA_LAYERS = ['dem', 'catchmentOutline', 'glacierOutline', 'debrisOutline', 'debrisThickness', 'snowCover', 'elevationChange'] as const;
export type GeodataLayer = (typeof GEODATA_LAYERS)[number];
/** Layers of which only the newest upload is in use (snow maps and elevation changes accumulate). */
export const SINGLE_LAYERS: readonly GeodataLayer[] = ['dem', 'catchmentOutline', 'glacierOutline', 'debrisOutline', 'debrisThickness'];
export const RASTER_LAYERS: readonly GeodataLayer[] = ['dem', 'debrisThickness', 'snowCover', 'elevationChange'];

export const LAYER_LABELS: Record<GeodataLayer, string> = {
  dem: 'Elevation model (DEM)',
  catchmentOutline: 'Catchment outline',
  glacierOutline: 'Glacier outlines',
  debrisOutline: 'Debris-cover outlines',
  debrisThickness: 'Debris thickness',
  snowCover: 'Snow-cover map',
  elevationChange: 'Glacier elevation change',
};

const isoDate = z.string().refine(isIsoDate, { message: 'must be a real date written YYYY-MM-DD' });
const codeList = z.string().trim().max(200)
  .refine((t) => t === '' || /^-?\d+(\s*,\s*-?\d+)*$/.test(t), { message: 'must be whole numbers separated by commas, e.g. 1 or 200, 201' })
  .transform((t) => (t === '' ? [] : t.split(',').map((v) => Number(v.trim()))));
const optionalNumber = (min: number, max: number) => z.union([z.literal('').transform(() => undefined), z.coerce.number().min(min).max(max)]).optional();

/** Form fields sent with an upload (multipart text fields, so numbers arrive as text). */
export const geodataUploadFieldsSchema = z.object({
  /** DEM elevations in feet when the file does not say so. */
  verticalUnit: z.enum(['', 'metre', 'foot', 'us-foot']).default(''),
  /** Snow-cover map: its date and which cell values mean snow, no snow, cloud, nodata. */
  observedOn: z.union([z.literal(''), isoDate]).default(''),
  snowCodes: codeList.default([1]),
  noSnowCodes: codeList.default([0]),
  cloudCodes: codeList.default([]),
  nodataCodes: codeList.default([]),
  /** Elevation change: a rate raster (m per year) or two DEMs, and the dates of the surveys. */
  changeKind: z.enum(['rate', 'two-dems']).default('rate'),
  fromDate: z.union([z.literal(''), isoDate]).default(''),
  toDate: z.union([z.literal(''), isoDate]).default(''),
  densityKgM3: optionalNumber(300, 1000),
  densitySigmaKgM3: optionalNumber(0, 300),
});
export type GeodataUploadFields = z.output<typeof geodataUploadFieldsSchema>;

export const geodataNoticeSchema = z.object({ code: z.string(), field: z.string(), message: z.string() });
export type GeodataNoticeReply = z.infer<typeof geodataNoticeSchema>;

/** What was read from a file, in a GIS user's words. */
export const uploadSummarySchema = z.object({
  system: z.string(),
  /** Lines such as "484 × 662 cells of 30 m" or "3 polygons, 85.2 km²". */
  facts: z.array(z.string()),
  notices: z.array(geodataNoticeSchema),
  fromDate: z.string().optional(),
  toDate: z.string().optional(),
});
export type UploadSummary = z.infer<typeof uploadSummarySchema>;

export const geodataUploadSchema = z.object({
  id: z.number().int(),
  layer: z.enum(GEODATA_LAYERS),
  fileName: z.string(),
  byteSize: z.number(),
  observedOn: z.string().nullable(),
  summary: uploadSummarySchema,
  createdAt: z.string(),
});
export type GeodataUpload = z.infer<typeof geodataUploadSchema>;

export const geodataLimitsSchema = z.object({ rasterFileMb: z.number(), rasterCellsMillion: z.number(), outlineFileMb: z.number() });
export const geodataUploadsReplySchema = z.object({ uploads: z.array(geodataUploadSchema), limits: geodataLimitsSchema });
export const geodataUploadReplySchema = z.object({ upload: geodataUploadSchema });

/** How bands are derived: band height, aspect split, horizon directions, the debris thickness without a raster. */
export const deriveRequestSchema = z.object({
  bandWidthM: z.number().int().min(10).max(2000).default(200),
  splitByAspect: z.boolean().default(false),
  horizonSectors: z.number().int().refine((n) => n === 0 || (n >= 8 && n <= 72), { message: 'must be 0 (no terrain shading) or from 8 to 72' }).default(36),
  debrisThicknessM: z.number().min(0).max(10).optional(),
});
export type DeriveRequest = z.input<typeof deriveRequestSchema>;

const derivedBandSchema = bandRowSchema.safeExtend({ skyViewFactor: z.number().optional(), hasHorizon: z.boolean() });

export const derivationSchema = z.object({
  id: z.number().int(),
  createdAt: z.string(),
  seconds: z.number(),
  options: z.object({ bandWidthM: z.number(), splitByAspect: z.boolean(), horizonSectors: z.number(), debrisThicknessM: z.number().optional() }),
  bands: z.array(derivedBandSchema),
  units: z.array(z.object({ trueAreaKm2: z.number(), meanElevationM: z.number(), aspectConsistency: z.number(), cells: z.number() })),
  hypsometry: z.array(z.object({ lowerM: z.number(), upperM: z.number(), areaKm2: z.number(), glacierAreaKm2: z.number(), debrisAreaKm2: z.number() })),
  summary: z.object({
    areaKm2: z.number(), trueAreaKm2: z.number(), glacierAreaKm2: z.number(), debrisAreaKm2: z.number(), minElevationM: z.number(),
    maxElevationM: z.number(), cellSizeM: z.number(), workingCrs: z.string(), nodataShare: z.number(),
  }),
  notices: z.array(geodataNoticeSchema),
  /** The band table in use was made from this derivation. */
  inUse: z.boolean(),
  /** A file it was derived from has been replaced since. */
  stale: z.boolean(),
});
export type Derivation = z.infer<typeof derivationSchema>;
export const derivationReplySchema = z.object({ derivation: derivationSchema });
export const derivationListReplySchema = z.object({ derivations: z.array(derivationSchema.pick({ id: true, createdAt: true, seconds: true, options: true, inUse: true, stale: true })) });

/** Polygons in the map's system: [polygon][ring][point][x, y]. */
const polygonsSchema = z.array(z.array(z.array(z.tuple([z.number(), z.number()]))));

/** What the map of a catchment draws, in the working grid's projected system (metres). */
export const catchmentMapSchema = z.object({
  derivationId: z.number().int(),
  crs: z.object({ name: z.string(), proj4: z.string() }),
  /** [minX, minY, maxX, maxY] of the hillshade and the cell layers. */
  extent: z.tuple([z.number(), z.number(), z.number(), z.number()]),
  width: z.number().int(),
  height: z.number().int(),
  outlines: z.object({ catchment: polygonsSchema, glacier: polygonsSchema, debris: polygonsSchema }),
  /** Row by row, runs of [band row index (−1 outside), count]. */
  units: z.array(z.array(z.number().int())),
  bands: z.array(bandRowSchema),
  bandTable: z.object({ id: z.number().int(), version: z.number().int(), source: z.enum(['entered', 'derived']) }).nullable(),
  station: z.object({ name: z.string(), elevationM: z.number(), x: z.number(), y: z.number() }),
});
export type CatchmentMap = z.infer<typeof catchmentMapSchema>;

export const snowCoverRowSchema = z.object({ lowerM: z.number(), upperM: z.number(), snowCoveredFraction: z.number().nullable(), validFraction: z.number(), cloudFraction: z.number() });
export const snowCoverMapSchema = z.object({
  uploadId: z.number().int(), observedOn: z.string(), fileName: z.string(),
  catchment: snowCoverRowSchema.omit({ lowerM: true, upperM: true }),
  rows: z.array(snowCoverRowSchema),
});
export type SnowCoverMap = z.infer<typeof snowCoverMapSchema>;

export const elevationChangeRowSchema = z.object({
  lowerM: z.number(), upperM: z.number(), glacierAreaKm2: z.number(), coveredFraction: z.number(), dhdtMPerYear: z.number(),
  dhdtSigmaMPerYear: z.number(), balanceMwePerYear: z.number(), balanceSigmaMwePerYear: z.number(),
});
export const elevationChangeSchema = z.object({
  uploadId: z.number().int(), fileName: z.string(), fromDate: z.string(), toDate: z.string(), densityKgM3: z.number(),
  rows: z.array(elevationChangeRowSchema),
});
export type ElevationChange = z.infer<typeof elevationChangeSchema>;
export const observationsReplySchema = z.object({ snowCover: z.array(snowCoverMapSchema), elevationChange: z.array(elevationChangeSchema) });
export type ObservationsReply = z.infer<typeof observationsReplySchema>;
