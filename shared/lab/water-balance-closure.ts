import { simulate } from '../melt/simulate';
import { addDays } from '../melt/calendar';
import type { SimulationResult } from '../melt/result';
import { invertWaterBalance, WaterBalanceNotClosedError, type BalanceCandidate, type BalanceObservations, type BalanceUnknown, type InversionResult, type ModelledBalance } from '../hydrology/water-balance';
import { HydrologyInputError } from '../hydrology/errors';
import { BALANCE_UNKNOWN_LABELS, type WaterBalanceClosure } from '../schemas/water-balance';
import { formatNumber } from '../text/numbers';
import { NO_WATER_SIDE } from '../analysis/water-side-inputs';
import { bandGlacierBalanceMm, glacierWideBalanceMm } from '../analysis/glacier-balance';
import { catchmentInput, forcingDays } from './calibration-set';
import { PARAMETER_SPECS } from '../melt/parameters';
import { PROFILE_PARAMETERS } from '../hydrology/precipitation-profile';
import type { LabSite, Period } from './site';

/**
 * The catchment's water balance over a period from one engine run, mm w.e. over the catchment
 * (P − E − ΔS_snow − ΔS_ice − ΔS_stores = R): precipitation, runoff at the outlet (routed where
 * routing is on), evaporation and sublimation, the change of snow (solid and held liquid) and of
 * glacier ice, the change of the routing stores, and the glacier balance per band and glacier-wide
 * (snow gained on the glacier part minus ice lost, with the band's snow spread evenly over it).
 */
export function modelledBalance(result: SimulationResult, glacierFraction: readonly number[]): ModelledBalance {
  const t = result.bandTotals;
  const area = result.bands.areaM2;
  const total = area.reduce((s, a) => s + a, 0);
  const mean = (pick: (b: number) => number) => area.reduce((s, a, b) => s + (a * pick(b)) / total, 0);
  const iceLoss = (b: number) => t.iceMeltMm[b] + t.debrisIceMeltMm[b] + t.iceVapourLossMm[b];
  const routed = result.catchmentDaily.routed;
  const volume = (series: Float64Array) => series.reduce((s, v) => s + v, 0);
  const runoffMm = routed ? (volume(routed.volumeM3.total) / total) * 1000 : mean((b) => t.runoffMm[b]);
  const bandBalanceMm = bandGlacierBalanceMm(result, glacierFraction);
  const glacierMassBalanceMm = glacierWideBalanceMm(result, glacierFraction, bandBalanceMm);
  return {
    precipitationMm: mean((b) => t.snowfallMm[b] + t.rainfallMm[b]),
    runoffMm,
    evaporationSublimationMm: mean((b) => t.sublimationMm[b] + t.evaporationMm[b]),
    snowStorageChangeMm: mean((b) => t.sweEndMm[b] - t.sweStartMm[b]),
    iceStorageChangeMm: -mean(iceLoss),
    storesChangeMm: routed ? mean((b) => t.runoffMm[b]) - runoffMm : 0,
    ...(glacierMassBalanceMm !== null ? { glacierMassBalanceMm } : {}),
    bandGlacierBalanceMm: bandBalanceMm,
    bandPrecipitationMm: Array.from(area, (_, b) => t.snowfallMm[b] + t.rainfallMm[b]),
  };
}

export interface ClosureTask {
  period: Period;
  form: 'linear' | 'peaked';
  unknowns: BalanceUnknown[];
  observations: BalanceObservations;
  /** Where the search starts, and what "station precipitation" means: factor 1 and the profile fitted from the stations. */
  station: BalanceCandidate;
  /** How the observations were put together, for the result. */
  observed: WaterBalanceClosure['observations'];
  /** What the result should say about the observations (bridged days, stakes left out). */
  notes?: string[];
}

/**
 * The precipitation the closure starts from and compares with: the station record (factor 1)
 * shaped by the profile the catchment's stations give (the chosen gradients when the catchment
 * uses them and they are one profile of this form for every month), else by the model parameters'
 * gradient (linear) or the documented default profile with its peak inside the bands (peaked).
 */
export function stationCandidate(site: LabSite, form: 'linear' | 'peaked'): BalanceCandidate {
  const profiles = site.water?.gradients?.profiles ?? [];
  const first = profiles[0];
  if (first && first.kind === form && profiles.every((p) => JSON.stringify(p) === JSON.stringify(first))) return { precipitationFactor: 1, profile: first };
  const gradient = site.parameters?.precipitationGradientPerKm ?? PARAMETER_SPECS.precipitationGradientPerKm.default;
  if (form === 'linear') return { precipitationFactor: 1, profile: { kind: 'linear', gradientPerKm: gradient } };
  const mids = site.catchment.bands.map((b) => (b.lowerM + b.upperM) / 2);
  const peak = Math.min(Math.max(PROFILE_PARAMETERS.peakElevationM.default, Math.min(...mids)), Math.max(...mids));
  return { precipitationFactor: 1, profile: { kind: 'peaked', peakElevationM: peak, gradientBelowPerKm: gradient, decreaseAbovePerKm: PROFILE_PARAMETERS.decreaseAbovePerKm.default } };
}

/** The balance of the site's catchment with a candidate precipitation: the station record × factor, shaped by the profile. */
export function balanceEvaluator(site: LabSite, period: Period, onEvaluation?: (count: number) => void) {
  const last = addDays(site.forcing.start, forcingDays(site.forcing) - 1);
  const to = period.to < last ? period.to : last;
  const glacier = site.catchment.bands.map((b) => b.glacierFraction);
  const water = site.water ?? NO_WATER_SIDE;
  let count = 0;
  return (candidate: BalanceCandidate): ModelledBalance => {
    onEvaluation?.(++count);
    const input = catchmentInput({ ...site, precipitationFactor: 1, useClosure: true, water: { ...water, closure: candidate } }, { from: period.from, to });
    return modelledBalance(simulate(input), glacier);
  };
}

const round = (v: number, digits = 2) => formatNumber(v, digits);

/**
 * The lab's water-balance closure (shared/hydrology/water-balance.ts, after Immerzeel et al. 2015):
 * the precipitation factor and profile that close the balance against the measured runoff and
 * stake balances within their stated accuracy, with the balance at the station precipitation
 * beside it. A balance that cannot close still reports its nearest attempt and why.
 */
export function closeWaterBalance(site: LabSite, task: ClosureTask, onEvaluation?: (count: number) => void): WaterBalanceClosure {
  const bands = site.catchment.bands;
  const base = { period: task.period, form: task.form, unknowns: [...task.unknowns], station: task.station, observations: task.observed };
  const perBand = (r: Omit<InversionResult, 'uncertainty'>) => bands.map((b, i) => ({
    midM: (b.lowerM + b.upperM) / 2, areaKm2: b.areaKm2,
    stationPrecipitationMm: r.stationModel.bandPrecipitationMm?.[i] ?? 0, inferredPrecipitationMm: r.inferred.bandPrecipitationMm?.[i] ?? 0,
  }));
  try {
    const r = invertWaterBalance({ observations: task.observations, evaluate: balanceEvaluator(site, task.period, onEvaluation), station: task.station, unknowns: task.unknowns, bands });
    const found = task.unknowns.map((u) => {
      const value = u === 'precipitationFactor' ? r.candidate.precipitationFactor : (r.candidate.profile as unknown as Record<string, number>)[u];
      const sigma = r.uncertainty[u];
      return `${BALANCE_UNKNOWN_LABELS[u]} ${round(value, u === 'peakElevationM' ? 0 : 2)}${sigma === null || sigma === undefined ? ' (not determined by the observations)' : ` ± ${round(sigma, u === 'peakElevationM' ? 0 : 2)}`}`;
    });
    return {
      ...base, closed: true,
      messages: [
        `The water balance closes with ${found.join(', ')}.`,
        `The inferred precipitation is ${round(r.precipitationRatio.value)} × the station precipitation over the catchment (± ${round(r.precipitationRatio.uncertainty)}, one standard uncertainty from the observations' stated accuracy).`,
        ...(task.notes ?? []),
      ],
      candidate: r.candidate, uncertainty: r.uncertainty, balance: r.balance, stationBalance: r.stationBalance,
      precipitationRatio: { value: r.precipitationRatio.value, uncertainty: Number.isFinite(r.precipitationRatio.uncertainty) ? r.precipitationRatio.uncertainty : null },
      misfits: r.misfits, bands: perBand(r), evaluations: r.evaluations,
    };
  } catch (error) {
    if (!(error instanceof WaterBalanceNotClosedError)) throw error instanceof HydrologyInputError ? new RangeError(error.issues.map((i) => i.message).join(' ')) : error;
    const r = error.nearest;
    return {
      ...base, closed: false, messages: [...error.issues.map((i) => i.message), ...(task.notes ?? [])],
      candidate: r.candidate, uncertainty: {}, balance: r.balance, stationBalance: r.stationBalance,
      precipitationRatio: { value: r.precipitationRatio.value, uncertainty: null },
      misfits: r.misfits, bands: perBand(r), evaluations: r.evaluations,
    };
  }
}
