import { refuse } from './errors';
import { fitLine } from './line-fit';
import { invert, leastSquares, normalMatrix } from './small-matrix';
import { PROFILE_PARAMETERS, precipitationMultiplier, type PrecipitationProfile } from './precipitation-profile';

/** One station's precipitation over the fitted period (mm; same period and unit at every station). */
export interface ProfilePoint {
  elevationM: number;
  precipitationMm: number;
}

export type ProfileParameter = 'gradientPerKm' | 'peakElevationM' | 'gradientBelowPerKm' | 'decreaseAbovePerKm';

export interface ProfileFit {
  profile: PrecipitationProfile;
  /** Precipitation of the fitted profile at the reference elevation, mm. */
  referencePrecipitationMm: number;
  /** Standard errors of the fitted parameters (fixed ones are absent); null with no degrees of freedom left. */
  standardErrors: Partial<Record<ProfileParameter, number | null>>;
  /** r² of the fit; null when assumed. */
  r2: number | null;
  n: number;
  status: 'fitted' | 'assumed';
  /** Plain sentences for the product: how it was fitted, and anything to watch. */
  notes: string[];
}

/**
 * Linear profile P(z) = a + b z by least squares, expressed as the relative gradient
 * g = 1000 b / P̂(zref) per km (standard error ≈ 1000 SE(b)/P̂(zref), ignoring the uncertainty of
 * P̂(zref)). With one station the gradient is assumed, not fitted.
 * @throws HydrologyInputError with no stations, or when the fitted line is not positive at the reference elevation
 * @example fitLinearProfile([{ elevationM: 2000, precipitationMm: 400 }, { elevationM: 3000, precipitationMm: 600 }], 2000, 0.5, 'stations').profile // { kind: 'linear', gradientPerKm: 0.5 }
 */
export function fitLinearProfile(points: readonly ProfilePoint[], referenceM: number, assumedGradientPerKm: number, path: string): ProfileFit {
  if (points.length === 0) refuse(path, 'no station has precipitation for this period.');
  if (points.length === 1) {
    return {
      profile: { kind: 'linear', gradientPerKm: assumedGradientPerKm },
      referencePrecipitationMm: points[0].precipitationMm,
      standardErrors: {},
      r2: null,
      n: 1,
      status: 'assumed',
      notes: ['Assumed, not fitted: only one station has precipitation for this period.'],
    };
  }
  const fit = fitLine(points.map((p) => p.elevationM), points.map((p) => p.precipitationMm), path);
  const atReference = fit.intercept + fit.slope * referenceM;
  if (!(atReference > 0)) refuse(path, `the fitted line gives no precipitation at the reference elevation (${referenceM} m); choose the gradient by hand.`);
  const notes = [fit.n === 2 ? 'Fitted through two stations: no standard error.' : `Fitted by least squares through ${fit.n} stations.`];
  return {
    profile: { kind: 'linear', gradientPerKm: (1000 * fit.slope) / atReference },
    referencePrecipitationMm: atReference,
    standardErrors: { gradientPerKm: fit.slopeStandardError === null ? null : (1000 * fit.slopeStandardError) / atReference },
    r2: fit.r2,
    n: fit.n,
    status: 'fitted',
    notes,
  };
}

/** Parameters of the peaked profile held fixed during the fit (the rest are fitted). */
export interface PeakedFitOptions {
  peakElevationM?: number;
  gradientBelowPerKm?: number;
  decreaseAbovePerKm?: number;
  /** Candidate peaks are searched every this many metres before refining; default 10. */
  searchStepM?: number;
}

interface PeakedCandidate {
  zp: number;
  /** Value of the rising line at the reference elevation, mm. */
  amount: number;
  gb: number;
  da: number;
  ssr: number;
}

/**
 * Least-squares fit of amount, gb, da (the free ones) for a given peak elevation; null when
 * undetermined. With L = min(z, zp) − zref and A = max(z − zp, 0), the model
 *   P = α (1 + gb L/1000)(1 − da A/1000)
 * is linear in α, β = α gb/1000 and γ = P(zp) da/1000 when da is free: P = α + β L − γ A.
 */
function fitAtPeak(points: readonly ProfilePoint[], zp: number, zRef: number, fixed: PeakedFitOptions): PeakedCandidate | null {
  const gbFixed = fixed.gradientBelowPerKm;
  const daFixed = fixed.decreaseAbovePerKm;
  const rows = points.map(({ elevationM: z }) => {
    const rise = Math.min(z, zp) - zRef;
    const above = Math.max(z - zp, 0);
    const fall = daFixed === undefined ? 1 : 1 - (daFixed * above) / 1000;
    const alphaColumn = (gbFixed === undefined ? 1 : 1 + (gbFixed * rise) / 1000) * fall;
    return [alphaColumn, ...(gbFixed === undefined ? [rise * fall] : []), ...(daFixed === undefined ? [-above] : [])];
  });
  const solution = leastSquares(rows, points.map((p) => p.precipitationMm));
  if (!solution) return null;
  const [amount, ...rest] = solution.coefficients;
  if (!(amount > 0)) return null;
  const gb = gbFixed ?? (1000 * rest[0]) / amount;
  const peakAmount = amount * (1 + (gb * (zp - zRef)) / 1000);
  if (!(peakAmount > 0)) return null;
  const da = daFixed ?? (1000 * rest[gbFixed === undefined ? 1 : 0]) / peakAmount;
  return { zp, amount, gb, da, ssr: solution.residualSumOfSquares };
}

function modelled(c: PeakedCandidate, zRef: number, z: number): number {
  return c.amount * (1 + (c.gb * (Math.min(z, c.zp) - zRef)) / 1000) * (1 - (c.da * Math.max(z - c.zp, 0)) / 1000);
}

/** Golden-section refinement of the peak elevation between two candidates. */
function refinePeak(points: readonly ProfilePoint[], lo: number, hi: number, zRef: number, fixed: PeakedFitOptions): PeakedCandidate | null {
  const ratio = (Math.sqrt(5) - 1) / 2;
  let a = lo;
  let b = hi;
  let best: PeakedCandidate | null = null;
  for (let i = 0; i < 40 && b - a > 0.01; i++) {
    const c = b - ratio * (b - a);
    const d = a + ratio * (b - a);
    const fc = fitAtPeak(points, c, zRef, fixed);
    const fd = fitAtPeak(points, d, zRef, fixed);
    if (fc && (!best || fc.ssr < best.ssr)) best = fc;
    if (fd && (!best || fd.ssr < best.ssr)) best = fd;
    if ((fc?.ssr ?? Infinity) < (fd?.ssr ?? Infinity)) b = d;
    else a = c;
  }
  return best;
}

/**
 * Peaked profile (see PrecipitationProfile) fitted to station precipitation by least squares:
 * for a given peak elevation the model is linear in the amount and the two gradients, so
 * those are solved exactly; the peak elevation is searched between the lowest and highest
 * station (a peak above every station cannot be located from stations — fix it, or find it from
 * the water balance) and refined by golden section. Standard errors from the linearised model,
 * s² (JᵀJ)⁻¹ with s² = SSR/(n − p) (common practice for nonlinear least squares).
 *
 * @param points stations' precipitation over one period, mm
 * @param referenceM elevation of the reference station, m
 * @param fixed parameters held fixed; the rest (and the peak amount) are fitted
 * @throws HydrologyInputError with fewer stations than parameters, or when the stations do not straddle the peak
 * @example fitPeakedProfile(stations, 2200, { decreaseAbovePerKm: 0.4 }, 'stations').profile // { kind: 'peaked', peakElevationM: …, gradientBelowPerKm: …, decreaseAbovePerKm: 0.4 }
 */
export function fitPeakedProfile(points: readonly ProfilePoint[], referenceM: number, fixed: PeakedFitOptions, path: string): ProfileFit {
  const free: ProfileParameter[] = [
    ...(fixed.peakElevationM === undefined ? (['peakElevationM'] as const) : []),
    ...(fixed.gradientBelowPerKm === undefined ? (['gradientBelowPerKm'] as const) : []),
    ...(fixed.decreaseAbovePerKm === undefined ? (['decreaseAbovePerKm'] as const) : []),
  ];
  const parameterCount = free.length + 1;
  if (points.length < parameterCount) {
    refuse(path, `the peaked profile has ${parameterCount} parameters to fit (the amount${free.length ? ' and ' + free.map(plainName).join(', ') : ''}), so it needs at least ${parameterCount} stations; there ${points.length === 1 ? 'is 1' : `are ${points.length}`}. Fix some parameters or use the linear profile.`);
  }
  const elevations = points.map((p) => p.elevationM);
  const lowest = Math.min(...elevations);
  const highest = Math.max(...elevations);
  let best: PeakedCandidate | null = null;
  let edge = false;
  if (fixed.peakElevationM !== undefined) {
    best = fitAtPeak(points, fixed.peakElevationM, referenceM, fixed);
  } else {
    const step = fixed.searchStepM ?? 10;
    let bestIndex = -1;
    const candidates: number[] = [];
    for (let z = lowest; z <= highest + 1e-9; z += step) candidates.push(Math.min(z, highest));
    candidates.forEach((zp, i) => {
      const c = fitAtPeak(points, zp, referenceM, fixed);
      if (c && (!best || c.ssr < best.ssr)) {
        best = c;
        bestIndex = i;
      }
    });
    if (best && bestIndex >= 0) {
      best = refinePeak(points, candidates[Math.max(0, bestIndex - 1)], candidates[Math.min(candidates.length - 1, bestIndex + 1)], referenceM, fixed) ?? best;
      edge = bestIndex === 0 || bestIndex === candidates.length - 1;
    }
  }
  if (!best) refuse(path, `these stations (${lowest}–${highest} m) do not determine the peaked profile: a peak is located only between stations below and above it. Give the peak elevation or the decrease above it, or find them from the water balance.`);
  const fit: PeakedCandidate = best;
  const n = points.length;
  const dof = n - parameterCount;
  const profile: PrecipitationProfile = { kind: 'peaked', peakElevationM: fit.zp, gradientBelowPerKm: fit.gb, decreaseAbovePerKm: fit.da };
  const mean = points.reduce((s, p) => s + p.precipitationMm, 0) / n;
  const sst = points.reduce((s, p) => s + (p.precipitationMm - mean) ** 2, 0);
  const notes = [dof === 0 ? `Fitted exactly through ${n} stations: no standard errors.` : `Fitted by least squares through ${n} stations.`];
  if (edge) notes.push('The best peak lies at the highest or lowest station: the true peak may lie beyond the stations.');
  for (const name of free) {
    const value = profile[name as keyof typeof profile] as number;
    const spec = PROFILE_PARAMETERS[name as keyof typeof PROFILE_PARAMETERS];
    if (value < spec.min || value > spec.max) notes.push(`The fitted ${plainName(name)} (${round(value)}) lies outside the documented range ${spec.min}–${spec.max} ${spec.unit}.`);
  }
  return {
    profile,
    referencePrecipitationMm: modelled(fit, referenceM, referenceM),
    standardErrors: standardErrors(points, fit, referenceM, free, dof),
    r2: sst > 0 ? 1 - fit.ssr / sst : 1,
    n,
    status: 'fitted',
    notes,
  };
}

function plainName(name: ProfileParameter): string {
  return { gradientPerKm: 'gradient', peakElevationM: 'peak elevation', gradientBelowPerKm: 'gradient below the peak', decreaseAbovePerKm: 'decrease above the peak' }[name];
}

function round(value: number): string {
  return Math.abs(value) >= 100 ? value.toFixed(0) : value.toPrecision(3);
}

const CANDIDATE_KEY = { peakElevationM: 'zp', gradientBelowPerKm: 'gb', decreaseAbovePerKm: 'da', gradientPerKm: 'gb' } as const;
const DIFFERENCE_STEP = { amount: 1e-4, zp: 1, gb: 1e-4, da: 1e-4 } as const;

/** Linearised standard errors of the free parameters, by central differences of the model. */
function standardErrors(points: readonly ProfilePoint[], fit: PeakedCandidate, zRef: number, free: ProfileParameter[], dof: number): Partial<Record<ProfileParameter, number | null>> {
  const out: Partial<Record<ProfileParameter, number | null>> = {};
  if (dof === 0) {
    for (const name of free) out[name] = null;
    return out;
  }
  const keys = ['amount', ...free.map((f) => CANDIDATE_KEY[f])] as const;
  const jacobian = points.map(({ elevationM: z }) => keys.map((k) => {
    const h = k === 'amount' ? fit.amount * DIFFERENCE_STEP.amount : DIFFERENCE_STEP[k];
    return (modelled({ ...fit, [k]: fit[k] + h }, zRef, z) - modelled({ ...fit, [k]: fit[k] - h }, zRef, z)) / (2 * h);
  }));
  const covariance = invert(normalMatrix(jacobian));
  const variance = fit.ssr / dof;
  free.forEach((name, i) => {
    const c = covariance?.[i + 1][i + 1];
    out[name] = c !== undefined && c >= 0 ? Math.sqrt(variance * c) : null;
  });
  return out;
}

/** Precipitation of the fitted profile at elevation z, mm (for charts: stations as points, the profile as a line). */
export function fittedPrecipitationMm(fit: ProfileFit, z: number, referenceM: number): number {
  return fit.referencePrecipitationMm * precipitationMultiplier(fit.profile, z, referenceM);
}
