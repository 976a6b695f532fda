import type { BandState } from './state';

/**
 * Black carbon and dust in the snow: a surface layer of mass Ms (snowSurfaceLayerMm) over the rest
 * of the pack, each with its own concentration, per m² of snow-covered ground.
 *
 * - Snowfall buries the surface: the new surface layer is the fresh snow (at the fresh-snow
 *   concentration) plus what is left of the old surface layer; the rest goes into the pack.
 * - Dry deposition (ng or µg per m² per hour) lands on the surface layer.
 * - Melt leaves impurities behind: of the impurity in melted snow only the scavenging share k
 *   (Flanner et al. 2007; Doherty et al. 2013) [memory] leaves with the meltwater, the rest stays on
 *   the surface; sublimation leaves it all. The surface layer is refilled from the pack below at
 *   the pack's concentration, so surface loads rise through the melt season.
 * Concentrations are capped at the albedo table's largest load.
 */
const MAX_BLACK_CARBON_NG_G = 50_000;
const MAX_DUST_UG_G = 5_000;

/** Fresh snow of mass `snow` (kg m⁻²) falls on a pack of `solid` kg m⁻² (per m² of snow-covered ground). */
export function buryUnderSnowfall(state: BandState, b: number, snow: number, solid: number, layerMass: number, freshBc: number, freshDust: number): void {
  if (solid <= 0) {
    state.surfaceBlackCarbonNgG[b] = state.packBlackCarbonNgG[b] = freshBc;
    state.surfaceDustUgG[b] = state.packDustUgG[b] = freshDust;
    return;
  }
  const oldSurface = solid < layerMass ? solid : layerMass;
  const oldPack = solid - oldSurface;
  const total = solid + snow;
  const newSurface = total < layerMass ? total : layerMass;
  const freshInSurface = snow < newSurface ? snow : newSurface;
  const oldInSurface = Math.min(newSurface - freshInSurface, oldSurface);
  const newPack = total - newSurface;
  mixLayers(state.surfaceBlackCarbonNgG, state.packBlackCarbonNgG, b, freshBc, snow, oldSurface, oldPack, freshInSurface, oldInSurface, newSurface, newPack);
  mixLayers(state.surfaceDustUgG, state.packDustUgG, b, freshDust, snow, oldSurface, oldPack, freshInSurface, oldInSurface, newSurface, newPack);
}

function mixLayers(
  surface: Float64Array, pack: Float64Array, b: number, fresh: number, snow: number,
  oldSurface: number, oldPack: number, freshInSurface: number, oldInSurface: number, newSurface: number, newPack: number,
): void {
  const all = surface[b] * oldSurface + pack[b] * oldPack + fresh * snow;
  const top = fresh * freshInSurface + surface[b] * oldInSurface;
  surface[b] = top / newSurface;
  pack[b] = newPack > 0 ? (all - top) / newPack : surface[b];
}

/** Dry deposition onto the surface layer of a pack of `solid` kg m⁻². */
export function depositOnSurface(state: BandState, b: number, blackCarbonNgM2: number, dustUgM2: number, solid: number, layerMass: number): void {
  const grams = 1000 * (solid < layerMass ? solid : layerMass);
  if (grams <= 0) return;
  state.surfaceBlackCarbonNgG[b] = Math.min(MAX_BLACK_CARBON_NG_G, state.surfaceBlackCarbonNgG[b] + blackCarbonNgM2 / grams);
  state.surfaceDustUgG[b] = Math.min(MAX_DUST_UG_G, state.surfaceDustUgG[b] + dustUgM2 / grams);
}

/**
 * The surface loses `melt` kg m⁻² to melting and `vapour` kg m⁻² to sublimation from a pack of
 * `solid` kg m⁻² (before the loss); scavenging shares kBc, kDust.
 */
export function enrichOnLoss(state: BandState, b: number, melt: number, vapour: number, solid: number, layerMass: number, kBc: number, kDust: number): void {
  const lost = melt + (vapour > 0 ? vapour : 0);
  if (lost <= 0) return;
  const surface = solid < layerMass ? solid : layerMass;
  const below = solid - surface;
  const refill = lost < below ? lost : below;
  const mass = surface - lost + refill;
  if (mass <= 0) return;
  leaveBehind(state.surfaceBlackCarbonNgG, state.packBlackCarbonNgG, b, kBc, MAX_BLACK_CARBON_NG_G, surface, melt, refill, mass);
  leaveBehind(state.surfaceDustUgG, state.packDustUgG, b, kDust, MAX_DUST_UG_G, surface, melt, refill, mass);
}

function leaveBehind(surfaceLoad: Float64Array, packLoad: Float64Array, b: number, k: number, cap: number, surface: number, melt: number, refill: number, mass: number): void {
  const kept = surfaceLoad[b] * surface - k * surfaceLoad[b] * melt + packLoad[b] * refill;
  surfaceLoad[b] = Math.min(cap, kept / mass);
}
