import { z } from 'zod';
import { timeZoneSchema } from './time-zones';

const trimmed = (max: number) => z.string().trim().max(max, `must be at most ${max} characters`);

/**
 * Impurities already in the catchment's fresh snow today, which every baseline carries. Defaults:
 * typical of High Mountain Asian fresh snow — black carbon tens of ng/g (4–80 ng/g on the Tibetan
 * Plateau, Xu et al. 2009) and dust of order 10 µg/g (Qian et al. 2015 review) [memory]; the
 * consultant sets the catchment's own.
 */
export const DEFAULT_BACKGROUND_LOADS = { blackCarbonSnowNgG: 30, dustSnowUgG: 10 } as const;
export const BACKGROUND_LOADS_SOURCE = 'Typical of fresh snow in High Mountain Asia: black carbon 4–80 ng/g on the Tibetan Plateau (Xu et al. 2009); dust of order 10 µg/g (Qian et al. 2015)';

/** What a consultant enters for a catchment; the server and the form both validate with it. */
export const catchmentFormSchema = z.object({
  name: trimmed(120).min(1, 'is required'),
  description: trimmed(2000).default(''),
  latitudeDeg: z.number({ message: 'must be a number' }).min(-90, 'must be between −90 and 90').max(90, 'must be between −90 and 90'),
  longitudeDeg: z.number({ message: 'must be a number' }).min(-180, 'must be between −180 and 180').max(180, 'must be between −180 and 180'),
  timeZone: timeZoneSchema,
  stationName: trimmed(120).min(1, 'is required'),
  stationElevationM: z.number({ message: 'must be a number' }).min(-500, 'must be between −500 and 9000 m').max(9000, 'must be between −500 and 9000 m'),
  outletDescription: trimmed(500).default(''),
  backgroundBlackCarbonNgG: z.number({ message: 'must be a number' }).min(0, 'must be at least 0 ng/g').max(50_000, 'must be at most 50 000 ng/g')
    .default(DEFAULT_BACKGROUND_LOADS.blackCarbonSnowNgG),
  backgroundDustUgG: z.number({ message: 'must be a number' }).min(0, 'must be at least 0 µg/g').max(5_000, 'must be at most 5 000 µg/g')
    .default(DEFAULT_BACKGROUND_LOADS.dustSnowUgG),
});
export type CatchmentForm = z.input<typeof catchmentFormSchema>;
export type CatchmentFields = z.output<typeof catchmentFormSchema>;

export const catchmentSchema = catchmentFormSchema.extend({
  id: z.number().int(),
  archived: z.boolean(),
  bandCount: z.number().int(),
  datasetCount: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Catchment = z.infer<typeof catchmentSchema>;

export const CATCHMENT_SORTS = ['name', 'stationElevationM', 'updatedAt', 'createdAt'] as const;
/** Largest page the server hands out, whatever the client asks for. */
export const MAX_PAGE_SIZE = 100;

export const catchmentListQuerySchema = z.object({
  page: z.coerce.number().int().min(1).default(1),
  perPage: z.coerce.number().int().min(1).default(25).transform((n) => Math.min(n, MAX_PAGE_SIZE)),
  sort: z.enum(CATCHMENT_SORTS).default('name'),
  descending: z.enum(['true', 'false']).default('false').transform((v) => v === 'true'),
  search: z.string().trim().max(120).default(''),
  archived: z.enum(['true', 'false']).default('false').transform((v) => v === 'true'),
});
export type CatchmentListQuery = z.input<typeof catchmentListQuerySchema>;

export const catchmentListSchema = z.object({
  catchments: z.array(catchmentSchema),
  total: z.number().int(),
  page: z.number().int(),
  perPage: z.number().int(),
});
export type CatchmentList = z.infer<typeof catchmentListSchema>;

export const catchmentReplySchema = z.object({ catchment: catchmentSchema });

/** POST /api/catchments/:id/archive */
export const catchmentArchiveSchema = z.object({ archived: z.boolean() });
