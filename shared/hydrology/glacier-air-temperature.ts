import type { ParameterSpec } from '../melt/parameters';
import { checkParameters } from './parameter-specs';

/**
 * Air temperature over a melting glacier after Greuell & Böhm 1998 (J. Glaciol. 44:9) [memory]:
 * air flowing down the glacier in a katabatic layer warms adiabatically and loses heat to the
 * 0 °C surface, so along the flowline it relaxes towards an equilibrium temperature:
 *   T(x) = (T0 − Teq) e^(−x/L) + Teq,   Teq = Γd b L,   L = H / CH,
 * x the horizontal distance down the flowline from the glacier top (m), T0 the free-air
 * temperature at the top (°C), b the flowline gradient (dz/dx), Γd the dry-adiabatic lapse rate
 * 9.77 K km⁻¹ (g/cp = 9.81/1004 [computed]), H the katabatic layer depth, CH the bulk transfer
 * coefficient. Shaw et al. 2016 (J. Glaciol. 62:185) apply this form with x measured from the
 * glacier top and T0 from an off-glacier station moved there by a lapse rate [memory]. Warming of
 * the free air reaches the tongue damped by e^(−x/L).
 */

export const DRY_ADIABATIC_K_PER_M = 9.81 / 1004;

export interface GlacierDampingParameters {
  /** L = H/CH, m. */
  lengthScaleM: number;
  /** Mean flowline gradient b (dz/dx, dimensionless; 0.1 ≈ 6°). */
  flowlineGradient: number;
}

export const GLACIER_DAMPING_PARAMETERS = {
  lengthScaleM: { default: 5000, min: 500, max: 20000, unit: 'm', source: 'L = H/CH with katabatic layer depth H ≈ 10–20 m and CH ≈ 2–5·10⁻³ (Greuell & Böhm 1998) [memory]; the default is an assumption inside that range' },
  flowlineGradient: { default: 0.15, min: 0.02, max: 0.6, unit: '-', source: 'mean surface gradient of the glacier along its flowline; valley-glacier tongues ≈ 0.05–0.25 [memory]; set it for the glacier' },
} as const satisfies Record<string, ParameterSpec>;

/** Refuses damping parameters outside their documented ranges. */
export function checkGlacierDamping(params: GlacierDampingParameters, path: string): void {
  checkParameters(GLACIER_DAMPING_PARAMETERS, params, path);
}

/**
 * On-glacier air temperature, °C, at a point `dropM` metres of elevation below the glacier top.
 * Applies only over a melting surface with warmer air above it: when the free air at the top is at
 * or below 0 °C there is no katabatic cooling and the free-air temperature is returned. Never
 * warmer than the free air at the same elevation (an assumption: the layer only cools).
 *
 * @param topFreeAirC free-air temperature at the glacier top, °C
 * @param freeAirC free-air temperature at the point (the lapse-rate value), °C
 * @param dropM elevation of the glacier top minus the point's elevation, m (≥ 0)
 * @example glacierAirTemperatureC(5, 11.5, 1000, { lengthScaleM: 5000, flowlineGradient: 0.15 }) // ≈ 6.71 (free air 11.5)
 */
export function glacierAirTemperatureC(topFreeAirC: number, freeAirC: number, dropM: number, params: GlacierDampingParameters): number {
  if (!(topFreeAirC > 0) || !(dropM > 0)) return freeAirC;
  const distanceM = dropM / params.flowlineGradient;
  const equilibriumC = DRY_ADIABATIC_K_PER_M * params.flowlineGradient * params.lengthScaleM;
  const t = (topFreeAirC - equilibriumC) * Math.exp(-distanceM / params.lengthScaleM) + equilibriumC;
  return t < freeAirC ? t : freeAirC;
}
