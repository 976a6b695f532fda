import type { ParameterSpec } from '../melt/parameters';
import { HydrologyInputError, refuse, type HydrologyIssue } from './errors';
import { observationList, termsOf, type BalanceObservations, type BalanceTerms, type Measured, type ModelledBalance, type Observation } from './water-balance-terms';
import { solveBounded } from './levenberg-marquardt';
import { PROFILE_PARAMETERS, type PrecipitationProfile } from './precipitation-profile';
import { invert } from './small-matrix';
import { bandMidM, type ElevationBand } from './stations';

/**
 * Precipitation closed by the catchment's water balance: over a period, P − E − ΔS_snow − ΔS_ice = R
 * (all depths in mm w.e. over the catchment area). The station precipitation is scaled by a factor
 * and reshaped by its profile until the modelled runoff matches the measured runoff — and, where
 * given, the modelled glacier mass balance matches the measured one — within their stated
 * uncertainties (weighted least squares, solved by bounded Levenberg–Marquardt). The approach of
 * inverting runoff and glacier mass balance for high-altitude precipitation follows Immerzeel et al.
 * 2015 (HESS 19:4673) [memory]. Uncertainty is propagated linearly: Cov(θ) = (JᵀJ)⁻¹ with J the
 * Jacobian of the σ-scaled residuals (common practice for weighted least squares).
 */

/** What the model is asked to run with. */
export interface BalanceCandidate {
  /** Multiplies the station precipitation everywhere. */
  precipitationFactor: number;
  profile: PrecipitationProfile;
}

export type { BalanceObservations, BalanceTerms, Measured, ModelledBalance } from './water-balance-terms';

export type BalanceEvaluator = (candidate: BalanceCandidate) => ModelledBalance;

export type BalanceUnknown = 'precipitationFactor' | 'gradientPerKm' | 'peakElevationM' | 'gradientBelowPerKm' | 'decreaseAbovePerKm';

export const PRECIPITATION_FACTOR: ParameterSpec = {
  default: 1, min: 0.3, max: 6, unit: '-',
  source: 'multiplies station precipitation; the precipitation needed to close High Asian water balances is often 2–4 × the valley stations (Immerzeel et al. 2015) [memory]; range an assumption',
};

export interface InversionInput {
  observations: BalanceObservations;
  evaluate: BalanceEvaluator;
  /** The station candidate (factor 1, the profile fitted from stations): the starting point and the comparison. */
  station: BalanceCandidate;
  /** What to find (at most as many as there are observations). */
  unknowns: readonly BalanceUnknown[];
  /** Needed to bound the peak elevation: between the lowest and highest band middle by default. */
  bands: readonly ElevationBand[];
  /** Search bounds; default the documented ranges. */
  bounds?: Partial<Record<BalanceUnknown, readonly [number, number]>>;
  /** An observation counts as matched within this many standard uncertainties; default 2. */
  closureSigma?: number;
  maxEvaluations?: number;
}

export interface InversionResult {
  candidate: BalanceCandidate;
  /** One standard uncertainty of each unknown; null where the observations do not determine it. */
  uncertainty: Partial<Record<BalanceUnknown, number | null>>;
  balance: BalanceTerms;
  /** The balance with station precipitation (the starting point). */
  stationBalance: BalanceTerms;
  /** Inferred over station precipitation (catchment means) and its standard uncertainty. */
  precipitationRatio: Measured;
  /** Modelled minus measured, in standard uncertainties, per observation. */
  misfits: { label: string; sigmas: number }[];
  inferred: ModelledBalance;
  stationModel: ModelledBalance;
  evaluations: number;
}

/** The balance cannot be closed inside the bounds: carries the nearest attempt for display. */
export class WaterBalanceNotClosedError extends HydrologyInputError {
  constructor(issues: HydrologyIssue[], readonly nearest: Omit<InversionResult, 'uncertainty'>) {
    super(issues);
    this.name = 'WaterBalanceNotClosedError';
  }
}

const UNKNOWN_LABEL: Record<BalanceUnknown, string> = {
  precipitationFactor: 'precipitation factor', gradientPerKm: 'precipitation gradient', peakElevationM: 'peak elevation',
  gradientBelowPerKm: 'gradient below the peak', decreaseAbovePerKm: 'decrease above the peak',
};

function boundsOf(unknown: BalanceUnknown, input: InversionInput): readonly [number, number] {
  const given = input.bounds?.[unknown];
  if (given) {
    if (!(given[0] < given[1])) refuse(`bounds.${unknown}`, `the lower bound must be below the upper bound (${given[0]} … ${given[1]}).`);
    return given;
  }
  if (unknown === 'precipitationFactor') return [PRECIPITATION_FACTOR.min, PRECIPITATION_FACTOR.max];
  if (unknown === 'peakElevationM') {
    // Beyond the lowest or highest band middle a peak no longer changes any band: bound it there.
    const mids = input.bands.map(bandMidM);
    const [lo, hi] = [Math.min(...mids), Math.max(...mids)];
    if (!(hi > lo)) refuse('bands', 'finding the peak elevation needs bands at two elevations at least.');
    return [lo, hi];
  }
  return [PROFILE_PARAMETERS[unknown].min, PROFILE_PARAMETERS[unknown].max];
}

type ProfileValues = Partial<Record<BalanceUnknown, number>>;

function valueOf(candidate: BalanceCandidate, unknown: BalanceUnknown): number {
  return unknown === 'precipitationFactor' ? candidate.precipitationFactor : (candidate.profile as ProfileValues)[unknown]!;
}

function candidateAt(station: BalanceCandidate, unknowns: readonly BalanceUnknown[], x: readonly number[]): BalanceCandidate {
  const candidate: BalanceCandidate = { precipitationFactor: station.precipitationFactor, profile: { ...station.profile } };
  unknowns.forEach((u, i) => {
    if (u === 'precipitationFactor') candidate.precipitationFactor = x[i];
    else (candidate.profile as ProfileValues)[u] = x[i];
  });
  return candidate;
}

function checkUnknowns(input: InversionInput, observationCount: number): void {
  const { unknowns, station } = input;
  if (unknowns.length === 0) refuse('unknowns', 'choose at least one quantity to find (e.g. the precipitation factor).');
  if (new Set(unknowns).size !== unknowns.length) refuse('unknowns', 'each quantity can be chosen once.');
  const allowed = station.profile.kind === 'linear' ? ['precipitationFactor', 'gradientPerKm'] : ['precipitationFactor', 'peakElevationM', 'gradientBelowPerKm', 'decreaseAbovePerKm'];
  unknowns.forEach((u, i) => {
    if (!allowed.includes(u)) refuse(`unknowns[${i}]`, `the ${UNKNOWN_LABEL[u] ?? u} is not part of a ${station.profile.kind} profile.`);
  });
  if (unknowns.length > observationCount) {
    refuse('unknowns', `${unknowns.length} unknowns (${unknowns.map((u) => UNKNOWN_LABEL[u]).join(', ')}) need at least ${unknowns.length} observations; there ${observationCount === 1 ? 'is only the runoff' : `are ${observationCount}`}. Add a glacier mass balance or keep some unknowns fixed.`);
  }
}

/** Why the balance did not close, in plain words, naming the observation and any bound reached. */
function notClosedIssues(observations: Observation[], model: ModelledBalance, unknowns: readonly BalanceUnknown[], x: number[], atBound: number[], closureSigma: number): HydrologyIssue[] {
  const limits = unknowns.flatMap((u, i) => (atBound[i] === 0 ? [] : [`the ${UNKNOWN_LABEL[u]} at its ${atBound[i] > 0 ? 'upper' : 'lower'} bound (${round(x[i])})`]));
  return observations.flatMap((o) => {
    const value = o.modelled(model)!;
    const sigmas = (value - o.measured.value) / o.measured.uncertainty;
    if (Math.abs(sigmas) <= closureSigma) return [];
    const side = sigmas < 0 ? 'below' : 'above';
    const withLimits = limits.length > 0 ? `even with ${limits.join(' and ')}, ` : '';
    return [{ path: o.path, message: `The water balance cannot be closed: ${withLimits}the modelled ${o.label} (${round(value)} mm) stays ${side} the measured ${round(o.measured.value)} ± ${round(o.measured.uncertainty)} mm. Check the record, the catchment area, the evaporation and the storage change, or widen the bounds.` }];
  });
}

/**
 * Derivatives are taken over 0.5 % of each unknown's range: a season of the engine responds
 * smoothly to precipitation only at that scale (snow thresholds and the last snow patches make
 * much smaller steps noisy), and the observations never resolve finer than that.
 */
const DIFFERENCE_STEP = 5e-3;

function round(v: number): string {
  return Math.abs(v) >= 100 ? v.toFixed(0) : Math.abs(v) >= 1 ? v.toFixed(2) : v.toPrecision(3);
}

/**
 * Finds the precipitation factor and profile parameters that close the water balance.
 * @throws HydrologyInputError for bad observations or unknowns; WaterBalanceNotClosedError when no candidate inside the bounds matches every observation within `closureSigma` standard uncertainties
 * @example invertWaterBalance({ observations: { runoffMm: { value: 900, uncertainty: 45 } }, evaluate, station, unknowns: ['precipitationFactor'], bands })
 */
export function invertWaterBalance(input: InversionInput): InversionResult {
  const { evaluate, station, unknowns, closureSigma = 2 } = input;
  const observations = observationList(input.observations, input.bands);
  checkUnknowns(input, observations.length);
  const bounds = unknowns.map((u) => boundsOf(u, input));
  let evaluations = 0;
  const run = (c: BalanceCandidate): ModelledBalance => {
    evaluations++;
    return evaluate(c);
  };
  const residualsOf = (m: ModelledBalance) => observations.map((o) => {
    const value = o.modelled(m);
    if (value === undefined || !Number.isFinite(value)) refuse(o.path, `the model gives no ${o.label} to compare with the measurement.`);
    return (value - o.measured.value) / o.measured.uncertainty;
  });
  const stationModel = run(station);
  residualsOf(stationModel); // refuses at once a model that lacks an observed quantity
  const start = unknowns.map((u, i) => Math.min(bounds[i][1], Math.max(bounds[i][0], valueOf(station, u))));
  const solve = (from: number[]) => solveBounded({
    residuals: (x) => residualsOf(run(candidateAt(station, unknowns, x))),
    lower: bounds.map((b) => b[0]),
    upper: bounds.map((b) => b[1]),
    start: from,
    maxEvaluations: input.maxEvaluations ?? 80,
    differenceStep: DIFFERENCE_STEP,
  });
  const closes = (r: number[]) => r.every((v) => Math.abs(v) <= closureSigma);
  let solution = solve(start);
  // A piecewise-linear profile has flat stretches where a step can stall; if the first search does
  // not close the balance, search again from spread starting points and keep the best.
  if (!closes(solution.residuals)) {
    for (const from of spreadStarts(bounds)) {
      const next = solve(from);
      if (next.cost < solution.cost) solution = next;
      if (closes(solution.residuals)) break;
    }
  }
  const candidate = candidateAt(station, unknowns, solution.x);
  const inferred = run(candidate);
  const measuredRunoff = input.observations.runoffMm.value;
  const base = {
    candidate,
    balance: termsOf(inferred, measuredRunoff),
    stationBalance: termsOf(stationModel, measuredRunoff),
    misfits: observations.map((o, i) => ({ label: o.label, sigmas: residualsOf(inferred)[i] })),
    inferred,
    stationModel,
  };
  const issues = notClosedIssues(observations, inferred, unknowns, solution.x, solution.atBound, closureSigma);
  if (issues.length > 0) {
    throw new WaterBalanceNotClosedError(issues, { ...base, precipitationRatio: { value: inferred.precipitationMm / stationModel.precipitationMm, uncertainty: Number.NaN }, evaluations });
  }
  const propagated = propagate(solution.x, bounds, (x) => {
    const m = run(candidateAt(station, unknowns, x));
    return { residuals: residualsOf(m), precipitationMm: m.precipitationMm };
  }, residualsOf(inferred), inferred.precipitationMm);
  const uncertainty: Partial<Record<BalanceUnknown, number | null>> = {};
  unknowns.forEach((u, i) => { uncertainty[u] = propagated.sigmas[i]; });
  return {
    ...base,
    uncertainty,
    precipitationRatio: { value: inferred.precipitationMm / stationModel.precipitationMm, uncertainty: propagated.precipitationSigma / stationModel.precipitationMm },
    evaluations,
  };
}

/** Starting points spread over the bounds: a 3-point grid per unknown for one or two, the box's corners and centre beyond. */
function spreadStarts(bounds: (readonly [number, number])[]): number[][] {
  const at = (b: readonly [number, number], t: number) => b[0] + t * (b[1] - b[0]);
  if (bounds.length <= 2) {
    const levels = [0.2, 0.5, 0.8];
    return bounds.reduce<number[][]>((points, b) => points.flatMap((p) => levels.map((t) => [...p, at(b, t)])), [[]]);
  }
  const corners = bounds.reduce<number[][]>((points, b) => points.flatMap((p) => [0.2, 0.8].map((t) => [...p, at(b, t)])), [[]]);
  return [bounds.map((b) => at(b, 0.5)), ...corners];
}

/**
 * Linear propagation of the observations' uncertainty: Cov(θ) = (JᵀJ)⁻¹ from forward differences
 * of the σ-scaled residuals, and σ_P² = ∇P Cov ∇Pᵀ for the catchment precipitation.
 */
function propagate(x: number[], bounds: (readonly [number, number])[], model: (x: number[]) => { residuals: number[]; precipitationMm: number }, r0: number[], p0: number): { sigmas: (number | null)[]; precipitationSigma: number } {
  const n = x.length;
  const jacobian = r0.map(() => new Array<number>(n).fill(0));
  const gradP = new Array<number>(n).fill(0);
  for (let j = 0; j < n; j++) {
    const span = bounds[j][1] - bounds[j][0];
    const h = (x[j] + DIFFERENCE_STEP * span <= bounds[j][1] ? 1 : -1) * DIFFERENCE_STEP * span;
    const shifted = [...x];
    shifted[j] += h;
    const m = model(shifted);
    m.residuals.forEach((r, k) => { jacobian[k][j] = (r - r0[k]) / h; });
    gradP[j] = (m.precipitationMm - p0) / h;
  }
  const jtj = Array.from({ length: n }, (_, a) => Array.from({ length: n }, (_, b) => jacobian.reduce((s, row) => s + row[a] * row[b], 0)));
  const covariance = invert(jtj);
  if (!covariance) return { sigmas: x.map(() => null), precipitationSigma: Number.NaN };
  const sigmas = covariance.map((row, i) => (row[i] >= 0 ? Math.sqrt(row[i]) : null));
  const varianceP = gradP.reduce((s, g, a) => s + g * covariance[a].reduce((t, c, b) => t + c * gradP[b], 0), 0);
  return { sigmas, precipitationSigma: Math.sqrt(Math.max(0, varianceP)) };
}
