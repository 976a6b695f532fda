import { z } from 'zod';
import type { BandRow } from '../schemas/catchment-bands';

/**
 * The two optional terrain fields a band may carry for the engine (everything else in a derived
 * row is the engine's band as stored):
 * - `skyViewFactor`: 0–1, area-weighted mean over the band's cells of Dozier & Frew's view factor;
 *   the engine uses it instead of (1 + cos β)/2 for diffuse sky and (1 − it) for terrain
 *   reflection and longwave.
 * - `horizonDeg`: n azimuth sectors (8–72; sector k centred on k·360/n° clockwise from north,
 *   covering ±180/n° around it) × 5 horizon elevation angles (degrees) at the 10th, 30th, 50th,
 *   70th and 90th percentile over the band's cells, non-decreasing within a sector. Read with
 *   `sunlitFraction`.
 */
export const terrainFieldsSchema = z.object({
  skyViewFactor: z.number().min(0).max(1).optional(),
  horizonDeg: z.array(
    z.array(z.number().min(-90).max(90)).length(5)
      .refine((q) => q.every((v, i) => i === 0 || v >= q[i - 1]), { message: 'horizon percentiles must not decrease' }),
  ).min(8).max(72).optional(),
});
export type TerrainFields = z.infer<typeof terrainFieldsSchema>;

/** A band derived from geodata: the stored band row plus the terrain fields. */
export type DerivedBand = BandRow & TerrainFields;
