import { z } from 'zod';

/** One stake reading: the balance of a point on the glacier over a period, in m water equivalent. */
export const stakeReadingSchema = z.object({
  stake: z.string(),
  elevationM: z.number(),
  from: z.string(),
  to: z.string(),
  balanceMWe: z.number(),
});
export type StakeReading = z.infer<typeof stakeReadingSchema>;

export const stakeReadingsSchema = z.object({ readings: z.array(stakeReadingSchema) });

/** Columns a stake file must have (any order, case-insensitive). */
export const STAKE_COLUMNS = ['stake', 'elevation_m', 'from', 'to', 'balance'] as const;
