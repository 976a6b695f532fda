import { LATENT_HEAT_FUSION, SECONDS_PER_HOUR, SPECIFIC_HEAT_ICE } from './constants';
import { FLUX, STEP_IN, STEP_IN_SIZE, surfaceFlux, type TurbulentAir } from './surface-flux';
import { LAYERS, stepTwoLayers } from './two-layer';
import type { SurfaceVapourTable } from './vapour';

/**
 * One hour of a snowpack, per m² of snow-covered ground: surface energy balance with a real
 * surface temperature, melt, refreezing and retention.
 *
 * Two layers: a surface layer of mass m1 = min(SWE, M1), M1 the mass within the diurnal damping
 * depth √(κ·1 d/π) (a thin-surface-layer scheme in the spirit of Tarboton & Luce 1996) [memory],
 * and the pack below it down to M2 more (the active layer; deeper snow is inert: assumption).
 * Conduction between their centres with the snow conductivity of Sturm et al. 1997 [memory].
 * Both layers are advanced together by one implicit step (two-layer.ts); if the surface would pass
 * 0 °C it is held at 0 °C and the surplus melts. So night-time cooling chills the surface layer, not the whole pack, and a 10 m w.e. pack
 * melts like a 1 m w.e. pack under the same weather.
 *
 * Liquid water (melt and rain) is held up to θ × (m1 + m2) (liquidWaterHoldingFraction, a few %;
 * common practice) and refreezes against the cold content of the surface layer, then of the layer
 * below, releasing its latent heat; what exceeds the holding capacity drains. Vapour exchange
 * (sublimation, deposition, evaporation, condensation) changes the solid mass.
 */
export const SNOW = {
  surfaceC: 0, deepC: 1, melt: 2, refrozen: 3, drained: 4, vapourLoss: 5, solid: 6, liquid: 7,
  netLongwave: 8, sensible: 9, latent: 10, evaporating: 11,
} as const;

export interface SnowLayers {
  /** Mass of the surface layer, kg m⁻². */
  surfaceMass: number;
  /** Largest mass of the layer below, kg m⁻². */
  deepMass: number;
  /** Snow density, kg m⁻³, for the distance between layer centres. */
  density: number;
  /** Snow thermal conductivity, W m⁻¹ K⁻¹. */
  conductivity: number;
  /** 2 ρ k: the conductance between the layer centres is this over (m1 + m2), W m⁻² K⁻¹. */
  conductance2: number;
  holdingFraction: number;
}

/** Thermal conductivity of snow, Sturm et al. 1997 (J. Glaciol. 43:26) [memory]: 0.138 − 1.01 ρ + 3.233 ρ², ρ in g cm⁻³. */
export function snowConductivity(densityKgM3: number): number {
  const rho = densityKgM3 / 1000;
  return 0.138 - 1.01 * rho + 3.233 * rho * rho;
}

/** Mass within the diurnal damping depth d = √(κ·86400 s/π) of a medium, kg m⁻² [computed]. */
export function diurnalLayerMass(densityKgM3: number, conductivity: number): number {
  const diffusivity = conductivity / (densityKgM3 * SPECIFIC_HEAT_ICE);
  return densityKgM3 * Math.sqrt((diffusivity * 86400) / Math.PI);
}

/** Largest mass of the snow below the surface layer that exchanges heat and holds water, kg m⁻² (assumption). */
export const ACTIVE_SNOW_MASS = 500;

export function snowLayers(densityKgM3: number, holdingFraction: number): SnowLayers {
  const conductivity = snowConductivity(densityKgM3);
  return { surfaceMass: diurnalLayerMass(densityKgM3, conductivity), deepMass: ACTIVE_SNOW_MASS, density: densityKgM3, conductivity, conductance2: 2 * densityKgM3 * conductivity, holdingFraction };
}

/** kg of water that refreezing takes to warm 1 kg of snow by 1 K: c_ice / Lf. */
const FREEZE_PER_KELVIN = SPECIFIC_HEAT_ICE / LATENT_HEAT_FUSION;

const flux = new Float64Array(10);
const layer = new Float64Array(3);
const stepInput = new Float64Array(STEP_IN_SIZE);

/**
 * Advances the pack by one hour. Writes SNOW.* into `out`. Masses in kg m⁻² (= mm w.e.) per m² of
 * snow-covered ground; `rainMm` is the rain falling on it this hour and `rainHeatWm2` the heat that
 * rain brings. The same as stepSnowFrom with its numbers given as arguments.
 */
export function stepSnow(
  out: Float64Array, table: SurfaceVapourTable, layers: SnowLayers, air: TurbulentAir,
  absorbedWm2: number, longInWm2: number, rainMm: number, rainHeatWm2: number,
  surfaceC: number, deepC: number, solid: number, liquid: number,
  drag: number, heightOverRoughness: number, stability: boolean,
): void {
  const input = stepInput;
  input[STEP_IN.absorbed] = absorbedWm2;
  input[STEP_IN.longIn] = longInWm2;
  input[STEP_IN.rain] = rainMm;
  input[STEP_IN.rainHeat] = rainHeatWm2;
  input[STEP_IN.surfaceC] = surfaceC;
  input[STEP_IN.deepC] = deepC;
  input[STEP_IN.solid] = solid;
  input[STEP_IN.liquid] = liquid;
  input[STEP_IN.drag] = drag;
  input[STEP_IN.heightOverRoughness] = heightOverRoughness;
  stepSnowFrom(out, input, table, layers, air, stability, false);
}

/**
 * One hour of the pack as stepSnow, reading its numbers from `input` (STEP_IN.*), as the hour loop
 * calls it; with `indexMelt`, the reference models' pack instead (stepSnowIndex). One entry for
 * both, so V8 compiles the hour loop alike for every model.
 */
export function stepSnowFrom(
  out: Float64Array, input: Float64Array, table: SurfaceVapourTable, layers: SnowLayers, air: TurbulentAir, stability: boolean, indexMelt: boolean,
): void {
  if (indexMelt) {
    stepSnowIndex(out, input, layers);
    return;
  }
  const surfaceC = input[STEP_IN.surfaceC];
  const solid = input[STEP_IN.solid];
  const m1 = solid < layers.surfaceMass ? solid : layers.surfaceMass;
  const rest = solid - m1;
  const m2 = rest < layers.deepMass ? rest : layers.deepMass;
  const k = m2 > 0 ? layers.conductance2 / (m1 + m2) : 0;

  surfaceFlux(flux, input, table, air, stability);
  stepTwoLayers(layer, flux[FLUX.total], flux[FLUX.slope], surfaceC, input[STEP_IN.deepC], m1, m2, k);
  let t1 = layer[LAYERS.surfaceC];
  let t2 = layer[LAYERS.deepC];
  let melt = layer[LAYERS.melt];
  const change = t1 - surfaceC;
  const latent = flux[FLUX.latent] - flux[FLUX.latentSlope] * change;
  let vapourLoss = -latent * SECONDS_PER_HOUR * flux[FLUX.inverseLatentHeat];
  let left = solid - melt;
  if (left < 0) { melt = solid; left = 0; }
  if (vapourLoss > left) vapourLoss = left;
  left -= vapourLoss;

  // Meltwater and rain refreeze against the cold content of the surface layer, then of the layer below.
  let water = input[STEP_IN.liquid] + melt + input[STEP_IN.rain];
  let refrozen = 0;
  if (t1 < 0 && water > 0 && m1 > 0) {
    const r = Math.min(water, m1 * -t1 * FREEZE_PER_KELVIN);
    water -= r;
    refrozen += r;
    t1 += r / (m1 * FREEZE_PER_KELVIN);
  }
  if (t2 < 0 && water > 0 && m2 > 0) {
    const r = Math.min(water, m2 * -t2 * FREEZE_PER_KELVIN);
    water -= r;
    refrozen += r;
    t2 += r / (m2 * FREEZE_PER_KELVIN);
  }
  left += refrozen;
  const capacity = layers.holdingFraction * (m1 + m2);
  const drained = water > capacity ? water - capacity : 0;

  out[SNOW.surfaceC] = t1 < 0 ? t1 : 0;
  out[SNOW.deepC] = t2 < 0 ? t2 : 0;
  out[SNOW.melt] = melt;
  out[SNOW.refrozen] = refrozen;
  out[SNOW.drained] = drained;
  out[SNOW.vapourLoss] = vapourLoss;
  out[SNOW.solid] = left;
  out[SNOW.liquid] = water - drained;
  out[SNOW.netLongwave] = input[STEP_IN.longIn] - flux[FLUX.longOut] - flux[FLUX.longSlope] * change;
  out[SNOW.sensible] = flux[FLUX.sensible] - flux[FLUX.sensibleSlope] * change;
  out[SNOW.latent] = latent;
  out[SNOW.evaporating] = surfaceC < 0 ? 0 : 1;
}

/**
 * The reference models' pack (degree-day, enhanced temperature index): input[STEP_IN.indexMelt]
 * kg m⁻² from the index, with the same retention and drainage, no refreezing and no vapour
 * exchange. Reads rain, solid and liquid water from `input` as stepSnowFrom does and writes the
 * same SNOW.* fields; temperatures stay at 0 °C.
 */
function stepSnowIndex(out: Float64Array, input: Float64Array, layers: SnowLayers): void {
  const solid = input[STEP_IN.solid];
  const melt = input[STEP_IN.indexMelt];
  const m = melt < solid ? melt : solid;
  const left = solid - m;
  const active = Math.min(left, layers.surfaceMass + layers.deepMass);
  const water = input[STEP_IN.liquid] + m + input[STEP_IN.rain];
  const capacity = layers.holdingFraction * active;
  const drained = water > capacity ? water - capacity : 0;
  out[SNOW.surfaceC] = 0;
  out[SNOW.deepC] = 0;
  out[SNOW.melt] = m;
  out[SNOW.refrozen] = 0;
  out[SNOW.drained] = drained;
  out[SNOW.vapourLoss] = 0;
  out[SNOW.solid] = left;
  out[SNOW.liquid] = water - drained;
  out[SNOW.netLongwave] = 0;
  out[SNOW.sensible] = 0;
  out[SNOW.latent] = 0;
  out[SNOW.evaporating] = 0;
}
