import { CAUTIONS, ICE_DARKENING_CAUTION } from '../text/cautions';
import { RANGED_TOTALS, type RunResults, type RunSetUp, type WaterBalance } from '../schemas/results';
import { PARAMETER_SPECS } from '../melt/parameters';
import { ENSEMBLE_PARAMETERS } from './ensemble-parameters';
import { SHORTWAVE_SOURCE_LABELS, START_LABELS, type CalibrationStatus } from './run-set-up';
import type { Run } from '../schemas/runs';
import { addedMeltTotals } from './added-melt-totals';
import type { Driver } from './drivers';
import { termLabel } from './drivers';
import { separateFactors, bitCount } from './factor-separation';
import { band5to95, seriesBand5to95 } from './percentiles';
import type { MemberKind } from './run-plan';
import { dailyOutletM3, dailyRunoffM3, type SimulationSummary } from './simulation-summary';

export interface ResultMember {
  kind: MemberKind;
  combinationMask: number | null;
  ensembleIndex: number | null;
  summary: SimulationSummary;
}

const sum = (values: readonly number[]) => values.reduce((a, b) => a + b, 0);
const toDischarge = (m3PerDay: readonly number[]) => m3PerDay.map((v) => v / 86400);

function monthsOf(summary: SimulationSummary): string[] {
  return [...new Set(summary.months.map((m) => m.month))].sort();
}

function bandMonthGrid(summary: SimulationSummary, months: string[], pick: (row: SimulationSummary['months'][number]) => number | null) {
  const grid = summary.bands.map(() => months.map((): number | null => null));
  for (const row of summary.months) grid[row.bandIndex][months.indexOf(row.month)] = pick(row);
  return grid;
}

/** Area-weighted catchment mean of a band × month field, per month. */
function catchmentMonthly(summary: SimulationSummary, months: string[], pick: (row: SimulationSummary['months'][number]) => number): number[] {
  const totalArea = sum(summary.bands.map((b) => b.areaM2));
  const out = months.map(() => 0);
  for (const row of summary.months) out[months.indexOf(row.month)] += (pick(row) * summary.bands[row.bandIndex].areaM2) / totalArea;
  return out;
}

function energyOf(summary: SimulationSummary, months: string[]) {
  return {
    netShortwave: catchmentMonthly(summary, months, (r) => r.netShortwaveWm2),
    netLongwave: catchmentMonthly(summary, months, (r) => r.netLongwaveWm2),
    sensibleHeat: catchmentMonthly(summary, months, (r) => r.sensibleHeatWm2),
  };
}

function bandAddedMm(baseline: SimulationSummary, variant: SimulationSummary) {
  const out = baseline.bands.map(() => ({ snow: 0, ice: 0, debrisIce: 0, rain: 0 }));
  const add = (summary: SimulationSummary, sign: number) => {
    for (const r of summary.months) {
      const b = out[r.bandIndex];
      b.snow += sign * r.snowMeltMm;
      b.ice += sign * r.iceMeltMm;
      b.debrisIce += sign * r.debrisIceMeltMm;
      b.rain += sign * r.rainMm;
    }
  };
  add(variant, 1);
  add(baseline, -1);
  return out;
}

function attributionOf(members: ResultMember[], drivers: readonly Driver[], baseline: SimulationSummary, variant: SimulationSummary, areaM2: number) {
  if (drivers.length === 0) return null;
  const volume = (s: SimulationSummary) => sum(dailyRunoffM3(s));
  const full = (1 << drivers.length) - 1;
  const values = Array.from({ length: full + 1 }, (_, mask) => {
    if (mask === 0) return volume(baseline);
    if (mask === full) return volume(variant);
    const member = members.find((m) => m.kind === 'combination' && m.combinationMask === mask);
    if (!member) throw new RangeError(`run results: combination ${mask} is missing`);
    return volume(member.summary);
  });
  const terms = separateFactors(values, drivers.length).map(({ mask, value }) => ({
    label: termLabel(drivers, mask), mask, drivers: bitCount(mask), addedVolumeM3: value, addedDepthMm: (value / areaM2) * 1000,
  }));
  return { terms, fullChangeM3: values[full] - values[0] };
}

/** Snow gained or lost per band by redistribution over the period; null when nothing moved in either simulation. */
function redistributionOf(baseline: SimulationSummary, variant: SimulationSummary) {
  const perBand = (s: SimulationSummary) => {
    const out = s.bands.map(() => ({ windDrift: 0, avalanche: 0 }));
    for (const r of s.months) {
      out[r.bandIndex].windDrift += r.windDriftMm;
      out[r.bandIndex].avalanche += r.avalancheMm;
    }
    return out;
  };
  const result = { baseline: perBand(baseline), variant: perBand(variant) };
  const moved = [...result.baseline, ...result.variant].some((b) => b.windDrift !== 0 || b.avalanche !== 0);
  return moved ? result : null;
}

/** Catchment-mean water balance of one simulation over the period, mm w.e. */
function waterBalanceOf(summary: SimulationSummary, areaM2: number): WaterBalance {
  const mean = (pick: (row: SimulationSummary['months'][number]) => number) =>
    sum(summary.months.map((r) => (pick(r) * summary.bands[r.bandIndex].areaM2) / areaM2));
  return {
    snowfallMm: mean((r) => r.snowfallMm), rainfallMm: mean((r) => r.rainfallMm), surfaceMeltMm: mean((r) => r.surfaceMeltMm),
    refrozenMm: mean((r) => r.refrozenMm), sublimationMm: mean((r) => r.sublimationMm), evaporationMm: mean((r) => r.evaporationMm),
    runoffMm: (sum(dailyRunoffM3(summary)) / areaM2) * 1000,
  };
}

const ENSEMBLE_LABELS = ENSEMBLE_PARAMETERS.map((name) => PARAMETER_SPECS[name].label.toLowerCase()).join(', ');

/**
 * Why a central run can fall outside its ensemble's 5–95 % range: the ensemble draws its
 * parameters uniformly across their whole published ranges, the central run keeps the scenario's
 * own (calibrated or default) values, and added melt responds unevenly to them.
 */
function centralNote(central: number, range: { p5: number; p95: number }): string | null {
  if (central >= range.p5 && central <= range.p95) return null;
  const side = central < range.p5 ? 'below' : 'above';
  return `The central run's added runoff lies ${side} the ensemble's 5–95 % range. The ensemble draws ${ENSEMBLE_LABELS} uniformly across their published ranges, `
    + 'while the central run keeps the scenario\'s own values (calibrated or default), which sit off-centre in those ranges; added melt responds unevenly to them. '
    + 'Read the range as the spread over the literature, and the central run as the estimate for this catchment.';
}

function ensembleOf(members: ResultMember[], centralShare: number) {
  const scenarios = members.filter((m) => m.kind === 'ensemble-scenario').sort((a, b) => a.ensembleIndex! - b.ensembleIndex!);
  if (scenarios.length === 0) return null;
  const baselines = new Map(members.filter((m) => m.kind === 'ensemble-baseline').map((m) => [m.ensembleIndex, m.summary]));
  const pairs = scenarios.map((m) => ({ variant: m.summary, baseline: baselines.get(m.ensembleIndex) ?? m.summary }));
  const discharge = pairs.map((p) => toDischarge(dailyRunoffM3(p.variant)));
  const added = pairs.map((p) => {
    const base = dailyRunoffM3(p.baseline);
    return toDischarge(dailyRunoffM3(p.variant).map((v, d) => v - base[d]));
  });
  const totals = pairs.map((p) => addedMeltTotals(p.baseline, p.variant));
  return {
    size: pairs.length,
    dischargeM3s: seriesBand5to95(discharge),
    addedDischargeM3s: seriesBand5to95(added),
    totals: Object.fromEntries(RANGED_TOTALS.map((key) => [key, band5to95(totals.map((t) => t[key] ?? 0))])),
    note: centralNote(centralShare, band5to95(totals.map((t) => t.addedShareOfBaselineRunoff))),
  };
}

/** What the server knows beside the stored members: the calibration check, the baseline's skill, and whether bare ice was darkened. */
export interface ResultContext {
  calibration: CalibrationStatus;
  skill: RunSetUp['skill'];
  iceDarkened: boolean;
  /** The run's water side in plain lines (waterSideLines). */
  waterSide: RunSetUp['waterSide'];
}

function setUpOf(variant: SimulationSummary, context: ResultContext): RunSetUp {
  return {
    start: variant.start ? { label: START_LABELS[variant.start.method], note: variant.start.note, adequate: variant.start.adequate } : null,
    shortwaveSource: variant.shortwaveSource ? SHORTWAVE_SOURCE_LABELS[variant.shortwaveSource] : null,
    calibration: context.calibration,
    skill: context.skill,
    waterSide: context.waterSide,
  };
}

/** The standard cautions, then what this run adds: a short record's spin-up and the bare-ice sensitivity. */
function cautionsOf(variant: SimulationSummary, context: ResultContext): string[] {
  return [
    ...CAUTIONS,
    ...(variant.start && !variant.start.adequate ? [variant.start.note] : []),
    ...(context.iceDarkened ? [ICE_DARKENING_CAUTION] : []),
  ];
}

/** Turns a finished run's members into what the results screens show. */
export function runResults(run: Run, catchmentName: string, members: ResultMember[], drivers: readonly Driver[], context: ResultContext): RunResults {
  const variant = members.find((m) => m.kind === 'scenario')?.summary;
  if (!variant) throw new RangeError('run results: the run has no scenario member');
  // A baseline run is its own reference: everything added is zero.
  const baseline = members.find((m) => m.kind === 'baseline')?.summary ?? variant;
  const months = monthsOf(variant);
  const areaM2 = sum(variant.bands.map((b) => b.areaM2));
  const base = dailyRunoffM3(baseline);
  let acc = 0;
  const totals = addedMeltTotals(baseline, variant);
  return {
    run,
    catchmentName,
    startDate: variant.startDate,
    dayCount: variant.dayCount,
    bands: variant.bands,
    totals,
    setUp: setUpOf(variant, context),
    waterBalance: { baseline: waterBalanceOf(baseline, areaM2), variant: waterBalanceOf(variant, areaM2) },
    dischargeM3s: { baseline: toDischarge(base), variant: toDischarge(dailyRunoffM3(variant)) },
    outletDischargeM3s: variant.routedDailyM3 && baseline.routedDailyM3 ? { baseline: toDischarge(dailyOutletM3(baseline)), variant: toDischarge(dailyOutletM3(variant)) } : null,
    bandRedistributionMm: redistributionOf(baseline, variant),
    cumulativeAddedM3: dailyRunoffM3(variant).map((v, d) => (acc += v - base[d])),
    bandAddedMm: bandAddedMm(baseline, variant),
    months,
    albedo: { baseline: bandMonthGrid(baseline, months, (r) => r.meanAlbedo), variant: bandMonthGrid(variant, months, (r) => r.meanAlbedo) },
    energy: { baseline: energyOf(baseline, months), variant: energyOf(variant, months) },
    attribution: run.attribution ? attributionOf(members, drivers, baseline, variant, areaM2) : null,
    ensemble: ensembleOf(members, totals.addedShareOfBaselineRunoff),
    cautions: cautionsOf(variant, context),
  };
}
