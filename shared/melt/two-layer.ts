import { LATENT_HEAT_FUSION, SECONDS_PER_HOUR, SPECIFIC_HEAT_ICE } from './constants';

/**
 * One implicit hour of a frozen surface layer (mass m1, temperature T1) over a second layer (m2,
 * T2), coupled by a conductance k (W m⁻² K⁻¹), under an external surface flux F linearised as
 * F(T) ≈ F(T1) − D (T − T1):
 *   c1 (T1' − T1)/Δt = F(T1') + k (T2' − T1'),   c2 (T2' − T2)/Δt = k (T1' − T2')
 * If T1' would exceed 0 °C the surface is held at 0 °C and the energy left over melts
 * (Lf = 3.34·10⁵ J kg⁻¹). Energy closes exactly: F(T1')Δt = Lf·melt + c1 m1 ΔT1 + c2 m2 ΔT2.
 * Writes LAYERS.* into `out`; m2 may be 0 (one layer). Written with reciprocals instead of
 * divisions where it can: this runs once per band-hour.
 */
export const LAYERS = { surfaceC: 0, deepC: 1, melt: 2 } as const;

const HEAT_PER_KG_HOUR = SPECIFIC_HEAT_ICE / SECONDS_PER_HOUR;
const MM_PER_JOULE = 1 / LATENT_HEAT_FUSION;

export function stepTwoLayers(out: Float64Array, flux: number, slope: number, surfaceC: number, deepC: number, m1: number, m2: number, conductance: number): void {
  const c1 = HEAT_PER_KG_HOUR * m1;
  const c2 = HEAT_PER_KG_HOUR * m2;
  const k = m2 > 0 ? conductance : 0;
  const a11 = c1 + slope + k;
  const b1 = c1 * surfaceC + flux + slope * surfaceC;
  const b2 = c2 * deepC;
  let t1: number;
  let t2: number;
  if (m2 > 0) {
    const a22 = c2 + k;
    const inverseDet = 1 / (a11 * a22 - k * k);
    t1 = (b1 * a22 + k * b2) * inverseDet;
    if (t1 <= 0) {
      out[LAYERS.surfaceC] = t1;
      t2 = (a11 * b2 + k * b1) * inverseDet;
      out[LAYERS.deepC] = t2 < 0 ? t2 : 0;
      out[LAYERS.melt] = 0;
      return;
    }
    t2 = b2 / a22;
  } else {
    t1 = b1 / a11;
    if (t1 <= 0) {
      out[LAYERS.surfaceC] = t1;
      out[LAYERS.deepC] = 0;
      out[LAYERS.melt] = 0;
      return;
    }
    t2 = 0;
  }
  const energy = (flux + slope * surfaceC + k * t2) * SECONDS_PER_HOUR + SPECIFIC_HEAT_ICE * m1 * surfaceC;
  out[LAYERS.surfaceC] = 0;
  out[LAYERS.deepC] = t2 < 0 ? t2 : 0;
  out[LAYERS.melt] = energy > 0 ? energy * MM_PER_JOULE : 0;
}
