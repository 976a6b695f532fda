import { LATENT_HEAT_SUBLIMATION, LATENT_HEAT_VAPORISATION, STEFAN_BOLTZMANN, ZERO_CELSIUS_K } from './constants';
import { stabilityFactor } from './turbulence';
import { surfaceTablePosition, type SurfaceVapourTable } from './vapour';

/**
 * External energy flux into a snow or ice surface at temperature ts ≤ 0 °C, W m⁻², and its
 * linearisation, written into `out` (no allocation):
 *   F = SWabs + L↓ − σ Ts⁴ + QH + QE + QR
 *   QH = ρa cp CH u fh (Ta − Ts)                       bulk method
 *   QE = L ρa CH u fh 0.622 (ea − es(Ts)) / P           bulk method, same coefficient (common practice)
 * with L = Ls below 0 °C (sublimation, deposition) and Lv at a melting surface (evaporation,
 * condensation), es over ice, emissivity 1, and QR the heat rain brings as it cools to 0 °C.
 * The surface energy balance then takes one implicit step with D = −dF/dTs.
 */
export const FLUX = { total: 0, slope: 1, longOut: 2, longSlope: 3, sensible: 4, sensibleSlope: 5, latent: 6, latentSlope: 7, latentHeat: 8, inverseLatentHeat: 9 } as const;

/**
 * Where the snow and ice steps (snow-pack.ts, ice-surface.ts) and surfaceFlux read their numbers
 * in the input array they are given: absorbed shortwave and incoming longwave (W m⁻²), the heat
 * rain brings (W m⁻²), the surface and lower layer temperatures (°C), the surface's neutral drag
 * coefficient and z/z0, and for snow the rain falling on it and the solid and liquid water of the
 * pack (kg m⁻²), for the reference models their index melt (kg m⁻²).
 *
 * Numbers travel in a Float64Array rather than as arguments because V8 boxes each floating-point
 * argument of a call it does not inline into a new heap object: at several per band-hour that was
 * the hour loop's only allocation and a good part of its time.
 */
export const STEP_IN = {
  absorbed: 0, longIn: 1, rainHeat: 2, surfaceC: 3, deepC: 4, drag: 5, heightOverRoughness: 6,
  rain: 7, solid: 8, liquid: 9, indexMelt: 10,
} as const;
export const STEP_IN_SIZE = 11;

export interface TurbulentAir {
  airC: number;
  /** Vapour pressure of the air, Pa. */
  vapourPa: number;
  windMs: number;
  /** ρa cp CH u for neutral air, W m⁻² K⁻¹. */
  sensibleCoefficient: number;
  /** ρa CH u 0.622 / P for neutral air, kg m⁻² s⁻¹ Pa⁻¹. */
  vapourCoefficient: number;
}

/**
 * Writes F, D and their parts (FLUX.*) at the surface temperature input[STEP_IN.surfaceC].
 *
 * @param stability whether the turbulent fluxes take the stability correction (turbulence.ts)
 */
export function surfaceFlux(out: Float64Array, input: Float64Array, table: SurfaceVapourTable, air: TurbulentAir, stability: boolean): void {
  const surfaceC = input[STEP_IN.surfaceC];
  const fh = stability ? stabilityFactor(air.airC, surfaceC, air.windMs, input[STEP_IN.drag], input[STEP_IN.heightOverRoughness]) : 1;
  const tk = surfaceC + ZERO_CELSIUS_K;
  const tk3 = tk * tk * tk;
  const longOut = STEFAN_BOLTZMANN * tk3 * tk;
  const longSlope = 4 * STEFAN_BOLTZMANN * tk3;
  const h = air.sensibleCoefficient * fh;
  const pos = surfaceTablePosition(surfaceC);
  const i = pos | 0;
  const f = pos - i;
  const es = table.pressurePa[i] + (table.pressurePa[i + 1] - table.pressurePa[i]) * f;
  const des = table.slopePaPerK[i] + (table.slopePaPerK[i + 1] - table.slopePaPerK[i]) * f;
  const latentHeat = surfaceC < 0 ? LATENT_HEAT_SUBLIMATION : LATENT_HEAT_VAPORISATION;
  const e = latentHeat * air.vapourCoefficient * fh;
  const sensible = h * (air.airC - surfaceC);
  const latent = e * (air.vapourPa - es);
  out[FLUX.total] = input[STEP_IN.absorbed] + input[STEP_IN.longIn] - longOut + sensible + latent + input[STEP_IN.rainHeat];
  out[FLUX.slope] = longSlope + h + e * des;
  out[FLUX.longOut] = longOut;
  out[FLUX.longSlope] = longSlope;
  out[FLUX.sensible] = sensible;
  out[FLUX.sensibleSlope] = h;
  out[FLUX.latent] = latent;
  out[FLUX.latentSlope] = e * des;
  out[FLUX.latentHeat] = latentHeat;
  out[FLUX.inverseLatentHeat] = surfaceC < 0 ? 1 / LATENT_HEAT_SUBLIMATION : 1 / LATENT_HEAT_VAPORISATION;
}
