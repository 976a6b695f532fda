import { z } from 'zod';
import { AVALANCHE_PARAMETERS } from '../hydrology/avalanche';
import { WIND_FACTOR } from '../hydrology/wind-drift';
import { ROUTING_PARAMETERS } from '../hydrology/runoff-routing';
import type { ParameterSpec } from './parameters';

/**
 * The catchment's water side in an engine input (see shared/hydrology/README.md, "Engine hooks"):
 * band climate from fitted vertical gradients, snow redistribution between bands in the daily
 * step, and routing of the daily runoff to the outlet. Each part is optional; without it the
 * engine behaves as before (its own lapse rate and precipitation gradient, bands that exchange
 * nothing, outlet discharge equal to the day's runoff).
 */

/** Optional overrides of a parameter table, each within its documented range. */
function overrides<T extends Record<string, ParameterSpec>>(specs: T) {
  return z.object(
    Object.fromEntries(Object.entries(specs).map(([key, s]) => [key, z.number().min(s.min).max(s.max).optional()])) as Record<keyof T, z.ZodOptional<z.ZodNumber>>,
  ).strict();
}

/**
 * Per band × month climate relative to the station (shared/hydrology bandClimate, band-major:
 * band b, month m at b·12 + m). Replaces the lapse-rate and precipitation-gradient parameters.
 */
export const bandClimateSchema = z.object({
  /** Free-air temperature at the band minus the station's, K. */
  temperatureOffsetK: z.array(z.number().min(-60).max(60)),
  /** The same over the band's snow-free glacier (damped by the katabatic layer where chosen), K. */
  glacierTemperatureOffsetK: z.array(z.number().min(-60).max(60)),
  /** Band precipitation as a multiple of the station's. */
  precipitationMultiplier: z.array(z.number().min(0).max(20)),
});

export const redistributionSchema = z.object({
  /** Gravitational transport from steep bands to the bands below (Bernhardt & Schulz 2010); null: off. */
  avalanche: z.object({
    parameters: overrides(AVALANCHE_PARAMETERS).default({}),
    /** Slope per band for the holding depth (e.g. of its steep part); default each band's mean slope. */
    releaseSlopeDeg: z.array(z.number().min(0).max(89.9)).optional(),
  }).nullable().default(null),
  /** Wind drift of each day's snowfall by per-band accumulation factors; null: off. */
  windDrift: z.object({ factors: z.array(z.number().min(WIND_FACTOR.min).max(WIND_FACTOR.max)) }).nullable().default(null),
});

/** Routing of runoff by source through linear reservoirs (Hock & Noetzli 1997) to the outlet. */
export const routingSchema = z.object({ parameters: overrides(ROUTING_PARAMETERS).default({}) });

const perSource = z.object({ snow: z.number().min(0), ice: z.number().min(0), debrisIce: z.number().min(0), rain: z.number().min(0) });
/** Water in the routing stores, m³ per source (a run's end state, to continue from). */
export const routingStateSchema = z.object({ surface: perSource, groundwater: perSource });

interface WaterSideInput {
  catchment: { bands: unknown[] };
  bandClimate?: { temperatureOffsetK: number[]; glacierTemperatureOffsetK: number[]; precipitationMultiplier: number[] };
  impuritiesByBand?: unknown[];
  redistribution?: { avalanche: { releaseSlopeDeg?: number[] } | null; windDrift: { factors: number[] } | null };
}

/** Per-band lists must hold one entry per band (band climate: twelve per band). */
export function checkWaterSide(input: WaterSideInput, ctx: z.RefinementCtx): void {
  const n = input.catchment.bands.length;
  const issue = (path: (string | number)[], have: number, want: number, what: string) =>
    ctx.addIssue({ code: 'custom', path, message: `has ${have} values; ${want} expected (${what})` });
  if (input.bandClimate) {
    for (const key of ['temperatureOffsetK', 'glacierTemperatureOffsetK', 'precipitationMultiplier'] as const) {
      const length = input.bandClimate[key].length;
      if (length !== n * 12) issue(['bandClimate', key], length, n * 12, 'twelve months per band, band by band');
    }
  }
  if (input.impuritiesByBand && input.impuritiesByBand.length !== n) issue(['impuritiesByBand'], input.impuritiesByBand.length, n, 'one per band');
  const slopes = input.redistribution?.avalanche?.releaseSlopeDeg;
  if (slopes && slopes.length !== n) issue(['redistribution', 'avalanche', 'releaseSlopeDeg'], slopes.length, n, 'one per band');
  const factors = input.redistribution?.windDrift?.factors;
  if (factors && factors.length !== n) issue(['redistribution', 'windDrift', 'factors'], factors.length, n, 'one per band');
}
