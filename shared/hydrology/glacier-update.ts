import { glacierSizeClass, normalisedThinning, type GlacierSizeClass } from './delta-h';
import { refuse, requireInRange } from './errors';
import type { GlacierBand, GlacierState } from './glacier-volume';
import { bandMidM } from './stations';

/**
 * Annual update of glacier area and thickness per band by the Δh-parameterisation (Huss et al.
 * 2010, HESS 14:815): the year's volume change ΔV = B A ρw/ρice is spread over the glacier as
 * h1 = h0 − fs Δh(hr), with the scaling fs found so that the new volume is exactly V0 + ΔV.
 * A band's glacier area follows its thickness: A1 = A0 (h1/h0)^½ for a parabolic cross-section
 * (the width rule of Huss & Hock 2015, Front. Earth Sci. 3:54 [memory]) or stays until the ice is
 * gone ('constant'); a band whose ice is gone loses its glacier. Because the area changes with fs,
 * fs is found by bisection (the volume is monotonic in fs). The curve was derived for retreat; a
 * positive balance is spread with the same shape, thickening the glacier bands and widening them up
 * to the band's area, never into bands without glacier (an assumption: no advance).
 */

export interface GlacierUpdateOptions {
  /** Default: from the glacier area at the start of the year (Huss et al. 2010 classes). */
  sizeClass?: GlacierSizeClass;
  /** Ice density converting the balance to an ice volume, kg m⁻³; 900 for ice (common practice). 850 ± 60 converts geodetic volume changes (Huss 2013, TC 7:877). */
  iceDensityKgM3?: number;
  areaRule?: 'parabolic' | 'constant';
}

export interface GlacierUpdate {
  state: GlacierState;
  /** Glacier share of each band after the update. */
  glacierFraction: Float64Array;
  /** Ice volume change, m³ (negative = loss). */
  volumeChangeM3: number;
  /** Part of a loss no ice was left to supply, m³ of ice (0 unless the glacier vanished). */
  unsuppliedM3: number;
  sizeClass: GlacierSizeClass;
}

const WATER_DENSITY = 1000;

/** Volume (m³) of the bands for scaling fs: thickness h0 ∓ fs Δh, area by the width rule. */
function volumeAt(fs: number, sign: number, a0: Float64Array, h0: Float64Array, dh: Float64Array, cap: Float64Array, exponent: number): number {
  let v = 0;
  for (let i = 0; i < a0.length; i++) {
    if (!(a0[i] > 0 && h0[i] > 0)) continue;
    const h = h0[i] + sign * fs * dh[i];
    if (h <= 0) continue;
    const a = Math.min(cap[i], a0[i] * Math.pow(h / h0[i], exponent));
    v += a * 1e6 * h;
  }
  return v;
}

/**
 * Applies one year's glacier-wide mass balance to the glacier geometry.
 * @param bands the catchment's bands (their areas cap glacier growth)
 * @param state glacier area (km²) and mean thickness (m) per band at the start of the year
 * @param massBalanceMm glacier-wide mass balance of the year, mm w.e. over the glacier area at its start
 * @throws HydrologyInputError for a balance that is not a number or outside ±20 m w.e., or mismatched arrays
 * @example updateGlacier(bands, state, -800).volumeChangeM3 // = −0.8 m × A × 1000/900
 */
export function updateGlacier(bands: readonly GlacierBand[], state: GlacierState, massBalanceMm: number, options: GlacierUpdateOptions = {}): GlacierUpdate {
  requireInRange(massBalanceMm, -20000, 20000, 'massBalanceMm', 'The glacier mass balance', 'mm w.e.');
  const rhoIce = options.iceDensityKgM3 ?? 900;
  requireInRange(rhoIce, 800, 920, 'iceDensityKgM3', 'The ice density', 'kg m⁻³');
  const n = bands.length;
  if (state.areaKm2.length !== n || state.thicknessM.length !== n) refuse('glacier', `the glacier state has ${state.areaKm2.length} bands; the catchment has ${n}.`);
  const a0 = state.areaKm2;
  const h0 = state.thicknessM;
  const live = Array.from({ length: n }, (_, i) => i).filter((i) => a0[i] > 0 && h0[i] > 0);
  const totalKm2 = live.reduce((s, i) => s + a0[i], 0);
  const sizeClass = options.sizeClass ?? glacierSizeClass(totalKm2);
  const exponent = (options.areaRule ?? 'parabolic') === 'parabolic' ? 0.5 : 0;
  const cap = Float64Array.from(bands, (b) => b.areaKm2);
  const v0 = volumeAt(0, 1, a0, h0, new Float64Array(n), cap, exponent);
  const wanted = ((massBalanceMm / 1000) * totalKm2 * 1e6 * WATER_DENSITY) / rhoIce;
  const done = (area: Float64Array, thickness: Float64Array, unsuppliedM3 = 0): GlacierUpdate => ({
    state: { areaKm2: area, thicknessM: thickness },
    glacierFraction: Float64Array.from(bands, (b, i) => area[i] / b.areaKm2),
    volumeChangeM3: volumeAt(0, 1, area, thickness, new Float64Array(n), cap, exponent) - v0,
    unsuppliedM3,
    sizeClass,
  });
  if (live.length === 0 || wanted === 0) return done(Float64Array.from(a0), Float64Array.from(h0));
  if (wanted <= -v0) return done(new Float64Array(n), new Float64Array(n), -wanted - v0);

  const mids = live.map((i) => bandMidM(bands[i]));
  const [zMin, zMax] = [Math.min(...mids), Math.max(...mids)];
  const dh = new Float64Array(n);
  for (const i of live) dh[i] = zMax > zMin ? normalisedThinning((zMax - bandMidM(bands[i])) / (zMax - zMin), sizeClass) : 1;
  // Bands the curve leaves untouched (Δh = 0 at the very top) still thin once all others are gone.
  const reach = (weights: Float64Array) => (wanted < 0 ? Math.max(...live.map((i) => (weights[i] > 0 ? h0[i] / weights[i] : 0))) : 0);
  let weights = dh;
  const sign = wanted < 0 ? -1 : 1;
  if (wanted < 0 && volumeAt(reach(dh), -1, a0, h0, dh, cap, exponent) > v0 + wanted) weights = Float64Array.from(dh, (d, i) => (live.includes(i) ? Math.max(d, 1e-6) : 0));
  let hi = wanted < 0 ? reach(weights) : 1;
  if (wanted > 0) while (volumeAt(hi, 1, a0, h0, weights, cap, exponent) < v0 + wanted) hi *= 2;
  let lo = 0;
  for (let k = 0; k < 200 && hi - lo > 1e-13 * Math.max(1, hi); k++) {
    const mid = (lo + hi) / 2;
    const below = volumeAt(mid, sign, a0, h0, weights, cap, exponent) < v0 + wanted;
    if (below === wanted < 0) hi = mid;
    else lo = mid;
  }
  const fs = (lo + hi) / 2;
  const area = new Float64Array(n);
  const thickness = new Float64Array(n);
  for (const i of live) {
    const h = h0[i] + sign * fs * weights[i];
    if (h <= 0) continue;
    thickness[i] = h;
    area[i] = Math.min(cap[i], a0[i] * Math.pow(h / h0[i], exponent));
  }
  return done(area, thickness);
}
