import { z } from 'zod';
import { isTimeZone } from '../melt/calendar';

const trimmed = (max: number) => z.string().trim().max(max, `must be at most ${max} characters`);

/** What a consultant enters for a catchment; the server and the form both validate with it. */
export const catchmentFormSchema = z.object({
  name: trimmed(120).min(1, 'is required'),
  description: trimmed(2000).default(''),
  latitudeDeg: z.number({ message: 'must be a number' }).min(-90, 'must be between −90 and 90').max(90, 'must be between −90 and 90'),
  longitudeDeg: z.number({ message: 'must be a number' }).min(-180, 'must be between −180 and 180').max(180, 'must be between −180 and 180'),
  timeZone: z.string().trim().min(1, 'is required').refine(isTimeZone, { message: 'is not a known IANA time zone (e.g. Asia/Kathmandu)' }),
  stationName: trimmed(120).min(1, 'is required'),
  stationElevationM: z.number({ message: 'must be a number' }).min(-500, 'must be between −500 and 9000 m').max(9000, 'must be between −500 and 9000 m'),
  outletDescription: trimmed(500).default(''),
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
