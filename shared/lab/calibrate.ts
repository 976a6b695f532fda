import { simulate } from '../melt/simulate';
import { addDays } from '../melt/calendar';
import { maximise, type SearchProgress } from './nelder-mead';
import { behaviouralRanges, type ParameterRange } from './behavioural-ranges';
import { skillScores, type SkillScores } from './skill-scores';
import { monthlyMeans, pairDaily, type DatedValue, type PairedSeries } from './paired-series';
import { catchmentInput, forcingDays, keySpec, siteWith, valueOf, withValues, type CalibrationKey, type CalibrationSet } from './calibration-set';
import type { LabSite, Period } from './site';

export interface DischargeEvaluation {
  daily: SkillScores;
  /** Null when fewer than two months have enough paired days. */
  monthly: SkillScores | null;
  series: PairedSeries;
  /** Monthly means of the paired days (months with enough days only). */
  monthlySeries: PairedSeries;
}

/**
 * Catchment discharge at the outlet (m³ s⁻¹, daily mean) over the period, after the engine's
 * spin-up through the record before it, so the snowpack is built before the scored days begin:
 * routed through the catchment's stores where its routing is on, else the day's melt and rain.
 */
export function simulateDischarge(site: LabSite, period: Period): { startDate: string; values: Float64Array } {
  const from = site.forcing.start > period.from ? site.forcing.start : period.from;
  const last = addDays(site.forcing.start, forcingDays(site.forcing) - 1);
  const result = simulate(catchmentInput(site, { from, to: period.to < last ? period.to : last }));
  return { startDate: result.startDate, values: (result.catchmentDaily.routed ?? result.catchmentDaily).dischargeM3s.total };
}

/** Daily and monthly skill of the simulated discharge over the period. */
export function evaluateDischarge(site: LabSite, observed: readonly DatedValue[], period: Period): DischargeEvaluation {
  const sim = simulateDischarge(site, period);
  const series = pairDaily(observed, sim.startDate, sim.values, period);
  if (series.dates.length < 2) throw new RangeError(`only ${series.dates.length} observed day(s) fall between ${period.from} and ${period.to}; at least two are needed`);
  const monthly = monthlyMeans(series);
  return {
    daily: skillScores(series.observed, series.simulated),
    monthly: monthly.dates.length >= 2 ? skillScores(monthly.observed, monthly.simulated) : null,
    series,
    monthlySeries: monthly,
  };
}

export interface CalibrateOptions {
  keys: readonly CalibrationKey[];
  period: Period;
  /** Where the search starts; the site's parameters are replaced by it. */
  start: CalibrationSet;
  maxEvaluations?: number;
  /** Stop when the simplex's KGE values differ by less than this; default 10⁻⁵. */
  tolerance?: number;
  seed?: number;
  signal?: AbortSignal;
  onProgress?: (progress: SearchProgress) => void;
  /** Progress of the behavioural-range sampling after the search: model runs done of total. */
  onRangeProgress?: (done: number, total: number) => void;
}

/** What a bounded search found, with how well the observations pin each parameter down. */
export interface SearchOutcome {
  set: CalibrationSet;
  keys: CalibrationKey[];
  evaluations: number;
  converged: boolean;
  /** Parameters the search left at (within 0.1 % of) a bound of their range: the optimum may lie beyond it. */
  atBounds: CalibrationKey[];
  /** Behavioural range of each parameter around the found set (see behavioural-ranges.ts). */
  ranges: ParameterRange[];
}

export interface CalibrationOutcome extends SearchOutcome {
  startScores: DischargeEvaluation;
  scores: DischargeEvaluation;
}

/** The objective, or −∞ for a set the skill cannot be computed for (the search moves away from it). */
export function orMinusInfinity(score: () => number): number {
  try {
    return score();
  } catch {
    return -Infinity;
  }
}

/**
 * A bounded Nelder–Mead search over 1–4 parameters of a calibration set, maximising `objective`
 * of the site run with each candidate set.
 */
export function searchSet(site: LabSite, objective: (candidate: LabSite) => number, options: Omit<CalibrateOptions, 'period'>): SearchOutcome {
  const keys = [...options.keys];
  if (keys.length < 1 || keys.length > 4 || new Set(keys).size !== keys.length) throw new RangeError('calibrate: choose one to four different parameters');
  const specs = keys.map(keySpec);
  const result = maximise((values) => orMinusInfinity(() => objective(siteWith(site, withValues(options.start, keys, values)))), {
    lower: specs.map((s) => s.min),
    upper: specs.map((s) => s.max),
    start: keys.map((k) => valueOf(options.start, k)),
    maxEvaluations: options.maxEvaluations ?? 80,
    tolerance: options.tolerance ?? 1e-5,
    seed: options.seed,
    signal: options.signal,
    onProgress: options.onProgress,
  });
  const set = withValues(options.start, keys, result.best);
  const atBounds = keys.filter((_, j) => {
    const margin = 1e-3 * (specs[j].max - specs[j].min);
    return result.best[j] <= specs[j].min + margin || result.best[j] >= specs[j].max - margin;
  });
  const { ranges } = behaviouralRanges((candidate) => orMinusInfinity(() => objective(siteWith(site, candidate))), set, keys, result.bestValue, {
    seed: options.seed, signal: options.signal, onProgress: options.onRangeProgress,
  });
  return { set, keys, evaluations: result.evaluations, converged: result.converged, atBounds, ranges };
}

/**
 * Automatic calibration: a bounded Nelder–Mead search over 1–4 parameters maximising the daily
 * Kling–Gupta efficiency of discharge over the period (KGE as objective: Gupta et al. 2009).
 */
export function calibrate(site: LabSite, observed: readonly DatedValue[], options: CalibrateOptions): CalibrationOutcome {
  const startScores = evaluateDischarge(siteWith(site, options.start), observed, options.period);
  const found = searchSet(site, (candidate) => evaluateDischarge(candidate, observed, options.period).daily.kge, options);
  return { ...found, startScores, scores: evaluateDischarge(siteWith(site, found.set), observed, options.period) };
}

export interface SplitSampleOutcome {
  calibration: CalibrationOutcome;
  /** Scores on the validation period with the starting set and with the calibrated set. */
  validationBefore: DischargeEvaluation;
  validationAfter: DischargeEvaluation;
}

/** Split-sample test (Klemeš 1986, Hydrol. Sci. J. 31:13): calibrate on one period, score on another. */
export function splitSample(site: LabSite, observed: readonly DatedValue[], options: CalibrateOptions & { validationPeriod: Period }): SplitSampleOutcome {
  const calibration = calibrate(site, observed, options);
  return {
    calibration,
    validationBefore: evaluateDischarge(siteWith(site, options.start), observed, options.validationPeriod),
    validationAfter: evaluateDischarge(siteWith(site, calibration.set), observed, options.validationPeriod),
  };
}
