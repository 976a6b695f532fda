import { ICE_CONDUCTIVITY, ICE_DENSITY_KG_M3, SECONDS_PER_HOUR } from './constants';
import { FLUX, STEP_IN, surfaceFlux, type TurbulentAir } from './surface-flux';
import { diurnalLayerMass } from './snow-pack';
import { LAYERS, stepTwoLayers } from './two-layer';
import type { SurfaceVapourTable } from './vapour';

/**
 * One hour of bare glacier ice, per m² of exposed ice: the same surface energy balance as snow
 * (surface-flux.ts) over two ice layers — the mass within the diurnal damping depth (≈ 160 kg m⁻²,
 * 17 cm) [computed] and one metre of ice below it with no heat flux at its base (assumption) — so
 * nights chill the surface, mornings repay it, and melt starts once the surface is back at 0 °C.
 * Meltwater runs off at once; vapour exchange takes ice away or adds it.
 */
export const ICE = { surfaceC: 0, deepC: 1, melt: 2, vapourLoss: 3, netLongwave: 4, sensible: 5, latent: 6, evaporating: 7 } as const;

export const ICE_SURFACE_MASS = diurnalLayerMass(ICE_DENSITY_KG_M3, ICE_CONDUCTIVITY);
export const ICE_DEEP_MASS = 1000;
const ICE_CONDUCTANCE = ICE_CONDUCTIVITY / ((ICE_SURFACE_MASS + ICE_DEEP_MASS) / (2 * ICE_DENSITY_KG_M3));

const flux = new Float64Array(10);
const layer = new Float64Array(3);

/** Reads absorbed shortwave, incoming longwave, the layer temperatures and the exchange (STEP_IN.*) from `input`; writes ICE.* into `out`. */
export function stepIce(out: Float64Array, input: Float64Array, table: SurfaceVapourTable, air: TurbulentAir, stability: boolean): void {
  const surfaceC = input[STEP_IN.surfaceC];
  surfaceFlux(flux, input, table, air, stability);
  stepTwoLayers(layer, flux[FLUX.total], flux[FLUX.slope], surfaceC, input[STEP_IN.deepC], ICE_SURFACE_MASS, ICE_DEEP_MASS, ICE_CONDUCTANCE);
  const t1 = layer[LAYERS.surfaceC];
  const change = t1 - surfaceC;
  const latent = flux[FLUX.latent] - flux[FLUX.latentSlope] * change;
  out[ICE.surfaceC] = t1;
  out[ICE.deepC] = layer[LAYERS.deepC];
  out[ICE.melt] = layer[LAYERS.melt];
  out[ICE.vapourLoss] = -latent * SECONDS_PER_HOUR * flux[FLUX.inverseLatentHeat];
  out[ICE.netLongwave] = input[STEP_IN.longIn] - flux[FLUX.longOut] - flux[FLUX.longSlope] * change;
  out[ICE.sensible] = flux[FLUX.sensible] - flux[FLUX.sensibleSlope] * change;
  out[ICE.latent] = latent;
  out[ICE.evaporating] = surfaceC < 0 ? 0 : 1;
}
