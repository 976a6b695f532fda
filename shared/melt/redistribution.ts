import { avalanche, DEFAULT_AVALANCHE_PARAMETERS, planAvalanching, type AvalanchePlan } from '../hydrology/avalanche';
import { planWindDrift, windDrift, type WindDriftPlan } from '../hydrology/wind-drift';
import type { Band, ParsedInput } from './schema';
import type { BandState } from './state';

/**
 * Snow redistribution between bands at the end of each simulated day (shared/hydrology/README.md,
 * "Engine hooks" 2): first wind drift of the day's snowfall that still lies on the ground, then
 * avalanching of what exceeds each band's holding capacity down the bands. Both act on the solid
 * snow (retained liquid water stays where it is), conserve Σ SWE·area, and allocate nothing per day.
 *
 * How the moved snow joins the band's snow cover (assumptions of this engine): drifted snow is
 * fresh snow, so it joins or leaves the band's fresh layer; avalanche snow is old snow, so it
 * leaves or joins the older snow without changing its snow-covered share (deposits go to the
 * snow-covered part first, as avalanche cones lie on snow); a band that had no snow takes the
 * grain size, temperatures and impurities of the band the snow came from, and a band that had
 * some mixes the pack's impurities and deep temperature by mass.
 */
export interface Redistribution {
  wind: WindDriftPlan | null;
  avalanche: AvalanchePlan | null;
  /** The band each band's avalanche snow comes from (the next higher one), −1 for the highest. */
  donor: Int32Array;
  /** The day's snowfall per band (filled by the loop), then what of it lies on the ground. */
  snowfallMm: Float64Array;
  sweBefore: Float64Array;
  windNetMm: Float64Array;
  avalancheNetMm: Float64Array;
}

/** Plans the day's redistribution for a run, or null when both processes are off. */
export function planRedistribution(input: ParsedInput, bands: readonly Band[]): Redistribution | null {
  const setting = input.redistribution;
  if (!setting || (!setting.avalanche && !setting.windDrift)) return null;
  const n = bands.length;
  const plan = setting.avalanche
    ? planAvalanching(bands, { ...DEFAULT_AVALANCHE_PARAMETERS, ...setting.avalanche.parameters }, setting.avalanche.releaseSlopeDeg)
    : null;
  const donor = new Int32Array(n).fill(-1);
  if (plan) for (let b = 0; b < n; b++) if (plan.receiver[b] >= 0) donor[plan.receiver[b]] = b;
  return {
    wind: setting.windDrift ? planWindDrift(bands, setting.windDrift.factors) : null,
    avalanche: plan,
    donor,
    snowfallMm: new Float64Array(n),
    sweBefore: new Float64Array(n),
    windNetMm: new Float64Array(n),
    avalancheNetMm: new Float64Array(n),
  };
}

/** Moves a day's snow between bands in `state`; the day's net changes are left in `r.windNetMm` and `r.avalancheNetMm`. */
export function redistributeDay(r: Redistribution, s: BandState): void {
  const n = r.snowfallMm.length;
  if (r.wind) {
    for (let b = 0; b < n; b++) r.snowfallMm[b] = r.snowfallMm[b] < s.sweMm[b] ? r.snowfallMm[b] : s.sweMm[b];
    windDrift(r.wind, r.snowfallMm, s.sweMm, r.windNetMm);
    for (let b = 0; b < n; b++) {
      const fresh = s.freshSweMm[b] + r.windNetMm[b];
      s.freshSweMm[b] = fresh > 0 ? fresh : 0;
    }
  }
  if (!r.avalanche) return;
  r.sweBefore.set(s.sweMm);
  if (avalanche(r.avalanche, s.sweMm, r.avalancheNetMm) === 0) return;
  const order = r.avalanche.order;
  for (let k = 0; k < n; k++) {
    const b = order[k];
    const net = r.avalancheNetMm[b];
    if (net < 0) loseOldSnow(s, b, r.sweBefore[b], -net);
    else if (net > 0) gainOldSnow(s, b, r.donor[b], r.sweBefore[b], net);
  }
}

function loseOldSnow(s: BandState, b: number, before: number, loss: number): void {
  const fresh = s.freshSweMm[b];
  const fromFresh = loss < fresh ? loss : fresh;
  s.freshSweMm[b] = fresh - fromFresh;
  const old = before - fresh;
  const fromOld = loss - fromFresh;
  if (old > 0 && fromOld > 0) s.peakSweMm[b] *= (old - fromOld) / old;
}

function gainOldSnow(s: BandState, b: number, donor: number, before: number, gain: number): void {
  const old = before - s.freshSweMm[b];
  if (before <= 0 && donor >= 0) {
    s.grainRadiusUm[b] = s.grainRadiusUm[donor];
    s.snowSurfaceC[b] = s.snowSurfaceC[donor];
    s.snowDeepC[b] = s.snowDeepC[donor];
    s.surfaceBlackCarbonNgG[b] = s.surfaceBlackCarbonNgG[donor];
    s.surfaceDustUgG[b] = s.surfaceDustUgG[donor];
    s.packBlackCarbonNgG[b] = s.packBlackCarbonNgG[donor];
    s.packDustUgG[b] = s.packDustUgG[donor];
  } else if (donor >= 0) {
    const total = before + gain;
    s.packBlackCarbonNgG[b] = (s.packBlackCarbonNgG[b] * before + s.packBlackCarbonNgG[donor] * gain) / total;
    s.packDustUgG[b] = (s.packDustUgG[b] * before + s.packDustUgG[donor] * gain) / total;
    s.snowDeepC[b] = (s.snowDeepC[b] * before + s.snowDeepC[donor] * gain) / total;
  }
  s.peakSweMm[b] = old > 0 ? s.peakSweMm[b] * ((old + gain) / old) : gain;
}
