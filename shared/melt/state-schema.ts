import { z } from 'zod';
import { routingStateSchema } from './water-side-schema';

/** Names of the per-band state variables a run carries from hour to hour (see state.ts). */
export const STATE_FIELDS = [
  'sweMm', 'liquidMeltMm', 'liquidRainMm', 'peakSweMm', 'freshSweMm', 'grainRadiusUm',
  'snowSurfaceC', 'snowDeepC', 'surfaceBlackCarbonNgG', 'surfaceDustUgG', 'packBlackCarbonNgG', 'packDustUgG',
  'horizonBlackCarbonNgM2', 'horizonDustUgM2', 'horizonDepthMm',
  'iceSurfaceC', 'iceDeepC', 'debrisSurfaceC', 'debrisUpperC', 'debrisLowerC',
] as const;
export type StateField = (typeof STATE_FIELDS)[number];

/**
 * The state a run ended with, as plain numbers per band: a later run can start from it. With
 * routing on it also holds the water in the routing stores, so the outlet hydrograph continues.
 */
/** Impurity masses of a buried horizon, per m²: years of a polluted accumulation zone reach ~10⁸–10⁹ ng m⁻² [computed: 2 m w.e. × 100 ng/g a year]. */
const MASS_FIELDS: readonly StateField[] = ['horizonBlackCarbonNgM2', 'horizonDustUgM2'];

export const engineStateSchema = z.object(
  Object.fromEntries(STATE_FIELDS.map((f) => [f, z.array(z.number().min(-100).max(MASS_FIELDS.includes(f) ? 1e13 : 1e7))])) as Record<StateField, z.ZodArray<z.ZodNumber>>,
).extend({ routing: routingStateSchema.optional() });
export type EngineState = z.output<typeof engineStateSchema>;
