import { STATE_FIELDS, type EngineState, type StateField } from './state-schema';

/**
 * Per-band state of a run, one Float64Array per variable (struct of arrays, so the hour loop
 * reads a band's values without objects):
 *   sweMm            solid snow water equivalent, mm w.e. over the band
 *   liquidMeltMm     liquid water held in the pack that came from melt, mm over the band
 *   liquidRainMm     liquid water held in the pack that came from rain, mm over the band
 *   peakSweMm        peak SWE of the older snow, from which its cover depletes (snow-cover.ts)
 *   freshSweMm       new snow lying evenly over the band until it melts or joins the older snow (band-day.ts)
 *   grainRadiusUm    optical grain radius of the surface snow
 *   snowSurfaceC     temperature of the snow surface layer (≤ 0)
 *   snowDeepC        temperature of the snow below it (≤ 0)
 *   surface…/pack…   black carbon (ng g⁻¹) and dust (µg g⁻¹) in the surface layer and in the pack below
 *   horizon…         impurity of a buried dirty horizon (ng or µg per m²) and the snow above it (impurities.ts)
 *   iceSurfaceC, iceDeepC                           bare-ice layers (≤ 0)
 *   debrisSurfaceC, debrisUpperC, debrisLowerC      debris nodes (surface, 15 % and 50 % of the thickness)
 */
export type BandState = Record<StateField, Float64Array>;

export function allocateState(bandCount: number): BandState {
  return Object.fromEntries(STATE_FIELDS.map((f) => [f, new Float64Array(bandCount)])) as BandState;
}

/** A fresh state: the given SWE (with fresh grains and each band's loads of fresh snow), everything at 0 °C. */
export function initialState(sweMm: ArrayLike<number>, freshGrainUm: number, blackCarbonNgG: ArrayLike<number>, dustUgG: ArrayLike<number>): BandState {
  const s = allocateState(sweMm.length);
  for (let b = 0; b < sweMm.length; b++) {
    s.sweMm[b] = sweMm[b];
    s.peakSweMm[b] = sweMm[b];
    s.grainRadiusUm[b] = freshGrainUm;
    s.surfaceBlackCarbonNgG[b] = blackCarbonNgG[b];
    s.packBlackCarbonNgG[b] = blackCarbonNgG[b];
    s.surfaceDustUgG[b] = dustUgG[b];
    s.packDustUgG[b] = dustUgG[b];
  }
  return s;
}

export function stateFromJson(state: EngineState): BandState {
  return Object.fromEntries(STATE_FIELDS.map((f) => [f, Float64Array.from(state[f])])) as BandState;
}

export function stateToJson(state: BandState): EngineState {
  return Object.fromEntries(STATE_FIELDS.map((f) => [f, Array.from(state[f])])) as Record<StateField, number[]>;
}

/** Total water in a band's pack, solid plus liquid, mm w.e. over the band. */
export function packWaterMm(state: BandState, band: number): number {
  return state.sweMm[band] + state.liquidMeltMm[band] + state.liquidRainMm[band];
}
