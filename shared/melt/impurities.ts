import type { BandState } from './state';

/**
 * Black carbon and dust in the snow, per m² of snow-covered ground: a surface layer of mass Ms
 * (snowSurfaceLayerMm) with its own concentration, the pack below it, and one buried dirty
 * horizon (the surface of an earlier melt season or a dusty spell) with its impurity mass and
 * the snow lying on top of it.
 *
 * - Snowfall buries the surface: the new surface layer is the fresh snow (at the fresh-snow
 *   concentration) plus what is left of the old surface layer. The buried part goes into the pack
 *   at the pack's concentration; what it held beyond that joins the buried horizon, so last
 *   summer's dirt reappears when the melt reaches it, not with the first melt of spring.
 * - Dry deposition (ng or µg per m² per hour) lands on the surface layer.
 * - Melt leaves impurities behind: of the impurity in melted snow only the scavenging share k
 *   (Flanner et al. 2007; Doherty et al. 2013) [memory] leaves with the meltwater, the rest stays on
 *   the surface; sublimation leaves it all. The surface layer is refilled from the pack at the
 *   pack's concentration, so surface loads rise through the melt season, towards the pack's
 *   concentration over k. When the surface reaches the buried horizon, its impurities join it.
 * - Where the whole pack is thinner than the surface layer, what melt leaves behind lies on the
 *   ground or ice below and no longer concentrates in the remaining snow (assumption).
 * Concentrations are capped at the albedo table's largest load.
 */
const MAX_BLACK_CARBON_NG_G = 50_000;
const MAX_DUST_UG_G = 5_000;

/**
 * Where the impurity steps read their numbers in the input array they are given (an array
 * instead of arguments for the reason given at STEP_IN in surface-flux.ts): the surface layer's
 * mass Ms and the scavenging shares (set once), the pack's solid mass (kg m⁻² of snow-covered
 * ground) before the step and after it, new snow (kg m⁻²) and its loads (ng g⁻¹, µg g⁻¹), the
 * mass lost to melt and to the air (kg m⁻²), and dry deposition this hour (ng m⁻², µg m⁻²); the
 * released… slots carry a buried horizon's load to the surface within afterSnowStep.
 */
export const IMPURITY_IN = {
  layerMass: 0, scavengingBlackCarbon: 1, scavengingDust: 2, solid: 3, snow: 4, freshBlackCarbon: 5, freshDust: 6,
  melt: 7, vapour: 8, depositBlackCarbon: 9, depositDust: 10, solidAfter: 11,
  released: 12, releasedBlackCarbon: 13, releasedDust: 14,
} as const;
export const IMPURITY_IN_SIZE = 15;

/** Fresh snow (IMPURITY_IN.snow, with its loads) falls on a pack of IMPURITY_IN.solid kg m⁻² (per m² of snow-covered ground). */
export function buryUnderSnowfall(state: BandState, b: number, input: Float64Array): void {
  const solid = input[IMPURITY_IN.solid];
  const freshBc = input[IMPURITY_IN.freshBlackCarbon];
  const freshDust = input[IMPURITY_IN.freshDust];
  if (solid <= 0) {
    state.surfaceBlackCarbonNgG[b] = state.packBlackCarbonNgG[b] = freshBc;
    state.surfaceDustUgG[b] = state.packDustUgG[b] = freshDust;
    state.horizonBlackCarbonNgM2[b] = state.horizonDustUgM2[b] = state.horizonDepthMm[b] = 0;
    return;
  }
  const snow = input[IMPURITY_IN.snow];
  const layerMass = input[IMPURITY_IN.layerMass];
  const oldSurface = solid < layerMass ? solid : layerMass;
  const oldPack = solid - oldSurface;
  const total = solid + snow;
  const newSurface = total < layerMass ? total : layerMass;
  const freshInSurface = snow < newSurface ? snow : newSurface;
  const keptOfSurface = Math.min(newSurface - freshInSurface, oldSurface);
  const buried = oldSurface - keptOfSurface;
  const freshToPack = snow - freshInSurface;
  const newPack = oldPack + buried + freshToPack;
  const excessBc = buried * Math.max(0, state.surfaceBlackCarbonNgG[b] - state.packBlackCarbonNgG[b]) * 1000;
  const excessDust = buried * Math.max(0, state.surfaceDustUgG[b] - state.packDustUgG[b]) * 1000;
  burySurfaceLoad(state.surfaceBlackCarbonNgG, state.packBlackCarbonNgG, b, freshBc, freshInSurface, keptOfSurface, newSurface, oldPack, buried, freshToPack, newPack);
  burySurfaceLoad(state.surfaceDustUgG, state.packDustUgG, b, freshDust, freshInSurface, keptOfSurface, newSurface, oldPack, buried, freshToPack, newPack);
  // The horizon sinks under the new snow; a new excess joins it at an impurity-weighted depth.
  const held = state.horizonBlackCarbonNgM2[b] + state.horizonDustUgM2[b] * 1000;
  const added = excessBc + excessDust * 1000;
  const depth = state.horizonDepthMm[b] + snow;
  state.horizonDepthMm[b] = held + added > 0 ? (held * depth + added * freshInSurface) / (held + added) : depth;
  state.horizonBlackCarbonNgM2[b] += excessBc;
  state.horizonDustUgM2[b] += excessDust;
}

function burySurfaceLoad(
  surface: Float64Array, pack: Float64Array, b: number, fresh: number, freshInSurface: number, keptOfSurface: number,
  newSurface: number, oldPack: number, buried: number, freshToPack: number, newPack: number,
): void {
  const buriedAtPack = Math.min(surface[b], pack[b]);
  surface[b] = (fresh * freshInSurface + surface[b] * keptOfSurface) / newSurface;
  pack[b] = newPack > 0 ? (pack[b] * oldPack + buriedAtPack * buried + fresh * freshToPack) / newPack : surface[b];
}

/** Loads (ng m⁻², µg m⁻² at input[bcSlot], input[dustSlot]) onto the surface layer of a pack of input[solidSlot] kg m⁻². */
function addToSurface(state: BandState, b: number, input: Float64Array, bcSlot: number, dustSlot: number, solidSlot: number): void {
  const solid = input[solidSlot];
  const layerMass = input[IMPURITY_IN.layerMass];
  const grams = 1000 * (solid < layerMass ? solid : layerMass);
  if (grams <= 0) return;
  state.surfaceBlackCarbonNgG[b] = Math.min(MAX_BLACK_CARBON_NG_G, state.surfaceBlackCarbonNgG[b] + input[bcSlot] / grams);
  state.surfaceDustUgG[b] = Math.min(MAX_DUST_UG_G, state.surfaceDustUgG[b] + input[dustSlot] / grams);
}

/**
 * The surface's impurities through the hour's snow step. The surface loses IMPURITY_IN.melt kg m⁻²
 * to melting and IMPURITY_IN.vapour to sublimation from a pack of IMPURITY_IN.solid kg m⁻² (before
 * the loss), with the scavenging shares; then, where `deposits`, the hour's dry deposition lands
 * on the pack left (IMPURITY_IN.solidAfter). One call for both, too large for V8 to inline, so
 * the hour loop's own inlining goes to its table reads.
 */
export function afterSnowStep(state: BandState, b: number, input: Float64Array, deposits: boolean): void {
  const melt = input[IMPURITY_IN.melt];
  const vapour = input[IMPURITY_IN.vapour];
  const solid = input[IMPURITY_IN.solid];
  const layerMass = input[IMPURITY_IN.layerMass];
  const lost = melt + (vapour > 0 ? vapour : 0);
  if (lost > 0 && solid > layerMass) {
    const below = solid - layerMass;
    const refill = lost < below ? lost : below;
    const mass = layerMass - lost + refill;
    if (mass > 0) {
      leaveBehind(state.surfaceBlackCarbonNgG, state.packBlackCarbonNgG, b, input[IMPURITY_IN.scavengingBlackCarbon], MAX_BLACK_CARBON_NG_G, layerMass, melt, refill, mass);
      leaveBehind(state.surfaceDustUgG, state.packDustUgG, b, input[IMPURITY_IN.scavengingDust], MAX_DUST_UG_G, layerMass, melt, refill, mass);
      const depth = state.horizonDepthMm[b] - lost;
      state.horizonDepthMm[b] = depth > 0 ? depth : 0;
      if (depth < layerMass && (state.horizonBlackCarbonNgM2[b] > 0 || state.horizonDustUgM2[b] > 0)) {
        input[IMPURITY_IN.released] = mass;
        input[IMPURITY_IN.releasedBlackCarbon] = state.horizonBlackCarbonNgM2[b];
        input[IMPURITY_IN.releasedDust] = state.horizonDustUgM2[b];
        addToSurface(state, b, input, IMPURITY_IN.releasedBlackCarbon, IMPURITY_IN.releasedDust, IMPURITY_IN.released);
        state.horizonBlackCarbonNgM2[b] = state.horizonDustUgM2[b] = state.horizonDepthMm[b] = 0;
      }
    }
  }
  if (deposits) addToSurface(state, b, input, IMPURITY_IN.depositBlackCarbon, IMPURITY_IN.depositDust, IMPURITY_IN.solidAfter);
}

function leaveBehind(surfaceLoad: Float64Array, packLoad: Float64Array, b: number, k: number, cap: number, surface: number, melt: number, refill: number, mass: number): void {
  const kept = surfaceLoad[b] * surface - k * surfaceLoad[b] * melt + packLoad[b] * refill;
  surfaceLoad[b] = Math.min(cap, kept / mass);
}
