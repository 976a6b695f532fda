import { LATENT_HEAT_SUBLIMATION, LATENT_HEAT_VAPORISATION, STEFAN_BOLTZMANN, ZERO_CELSIUS_K } from './constants';
import { stabilityFactor } from './turbulence';
import { surfaceTablePosition, type SurfaceVapourTable } from './vapour';

/**
 * External energy flux into a snow or ice surface at temperature ts ≤ 0 °C, W m⁻², and its
 * linearisation, written into `out` (no allocation):
 *   F = SWabs + L↓ − σ Ts⁴ + QH + QE + QR
 *   QH = ρa cp CH u fh (Ta − Ts)                       bulk method
 *   QE = L ρa CH u fh 0.622 (ea − es(Ts)) / P           bulk method, same coefficient (SCIENCE: common practice)
 * with L = Ls below 0 °C (sublimation, deposition) and Lv at a melting surface (evaporation,
 * condensation), es over ice, emissivity 1, and QR the heat rain brings as it cools to 0 °C.
 * The surface energy balance then takes one implicit step with D = −dF/dTs.
 */
export const FLUX = { total: 0, slope: 1, longOut: 2, longSlope: 3, sensible: 4, sensibleSlope: 5, latent: 6, latentSlope: 7, latentHeat: 8, inverseLatentHeat: 9 } as const;

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
 * @param stability null for neutral exchange, else the neutral drag coefficient and z/z0 of the surface
 */
export function surfaceFlux(
  out: Float64Array, table: SurfaceVapourTable, absorbedWm2: number, longInWm2: number, rainHeatWm2: number,
  air: TurbulentAir, surfaceC: number, drag: number, heightOverRoughness: number, stability: boolean,
): void {
  const fh = stability ? stabilityFactor(air.airC, surfaceC, air.windMs, drag, heightOverRoughness) : 1;
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
  out[FLUX.total] = absorbedWm2 + longInWm2 - longOut + sensible + latent + rainHeatWm2;
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
