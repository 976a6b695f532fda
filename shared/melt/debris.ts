import { STEFAN_BOLTZMANN, ZERO_CELSIUS_K } from './constants';

/**
 * Debris surface temperature from its own energy balance with conduction to ice at 0 °C through
 * a layer of thickness h (Nicholson & Benn 2006, J. Glaciol. 52:463, steady linear profile):
 *   SWabs + L↓ − εσTs⁴ + Hc (Ta − Ts) − (k/h) Ts = 0   (Ts, Ta in °C in the linear terms)
 * The left side is concave and falling in Ts, so Newton's method from the tangent at 0 °C
 * converges quickly; three steps leave a residual below 10⁻³ W m⁻² for −60 … 80 °C (tested).
 * Scalar in, scalar out: nothing is allocated.
 *
 * @param absorbedShortwaveWm2 SW↓ (1 − αdebris), W m⁻²
 * @param incomingLongwaveWm2 L↓, W m⁻²
 * @param airTempC air temperature, °C
 * @param sensibleCoefficient ρa cp CH u, W m⁻² K⁻¹
 * @param conductance k/h, W m⁻² K⁻¹
 * @param emissivity debris emissivity (≈ 0.95) [memory]
 * @returns debris surface temperature, °C
 */
export function debrisSurfaceTemperature(
  absorbedShortwaveWm2: number,
  incomingLongwaveWm2: number,
  airTempC: number,
  sensibleCoefficient: number,
  conductance: number,
  emissivity: number,
): number {
  const es = emissivity * STEFAN_BOLTZMANN;
  const t0 = ZERO_CELSIUS_K;
  const source = absorbedShortwaveWm2 + incomingLongwaveWm2 + sensibleCoefficient * airTempC;
  const linear = sensibleCoefficient + conductance;
  let ts = (source - es * t0 * t0 * t0 * t0) / (linear + 4 * es * t0 * t0 * t0);
  for (let i = 0; i < 3; i++) {
    const tk = ts + t0;
    const tk3 = tk * tk * tk;
    const f = source - es * tk3 * tk - linear * ts;
    ts += f / (4 * es * tk3 + linear);
  }
  return ts;
}

/** Heat conducted to the ice, W m⁻² (≥ 0: a cold debris layer does not melt ice and is not carried over). */
export function debrisConductiveFlux(surfaceTempC: number, conductance: number): number {
  return surfaceTempC > 0 ? conductance * surfaceTempC : 0;
}
