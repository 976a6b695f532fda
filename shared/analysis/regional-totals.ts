import { addedMeltTotals } from './added-melt-totals';
import { band5to95 } from './percentiles';
import { dailyRunoffM3, type SimulationSummary } from './simulation-summary';
import type { MemberKind } from './run-plan';
import type { TransientSummary } from './transient-member';
import { addDays } from '../melt/calendar';
import { SOURCES } from '../melt/result';

/** The members of one finished run that a regional total needs. */
export interface ContributionMember {
  kind: MemberKind;
  ensembleIndex: number | null;
  summary: SimulationSummary;
}

/** The members of one finished multi-decade run (a baseline and a scenario, no ensemble). */
export interface TransientContributionMember {
  kind: MemberKind;
  summary: Pick<TransientSummary, 'bands' | 'years'>;
}

/** One catchment's part of a regional total: its run's added melt (variant minus paired baseline). */
export interface CatchmentContribution {
  addedVolumeM3: number;
  meanAddedDischargeM3s: number;
  addedDepthMm: number;
  areaKm2: number;
  /** Added runoff per calendar month ("YYYY-MM") of a season run, or per year ("YYYY") of a multi-decade run, m³. */
  addedByPeriodM3: Map<string, number>;
  /** Added volume of each ensemble member, by ensemble index; empty without an ensemble. */
  ensembleAddedM3: Map<number, number>;
  ensembleAddedDischargeM3s: Map<number, number>;
}

const sum = (values: Iterable<number>) => { let s = 0; for (const v of values) s += v; return s; };

/**
 * A catchment's contribution, from its run's stored members: the totals are those of the run's
 * results (`addedMeltTotals`), so the regional sum equals the sum of the catchments' results.
 */
export function catchmentContribution(members: readonly ContributionMember[]): CatchmentContribution {
  const variant = members.find((m) => m.kind === 'scenario')?.summary;
  if (!variant) throw new RangeError('catchmentContribution: the run has no scenario member');
  const baseline = members.find((m) => m.kind === 'baseline')?.summary ?? variant;
  const totals = addedMeltTotals(baseline, variant);
  const base = dailyRunoffM3(baseline);
  const addedByPeriodM3 = new Map<string, number>();
  dailyRunoffM3(variant).forEach((v, d) => {
    const month = addDays(variant.startDate, d).slice(0, 7);
    addedByPeriodM3.set(month, (addedByPeriodM3.get(month) ?? 0) + v - base[d]);
  });
  const ensembleAddedM3 = new Map<number, number>();
  const ensembleAddedDischargeM3s = new Map<number, number>();
  for (const m of members) {
    if (m.kind !== 'ensemble-scenario' || m.ensembleIndex === null) continue;
    const pair = members.find((b) => b.kind === 'ensemble-baseline' && b.ensembleIndex === m.ensembleIndex)?.summary ?? m.summary;
    const t = addedMeltTotals(pair, m.summary);
    ensembleAddedM3.set(m.ensembleIndex, t.addedVolumeM3);
    ensembleAddedDischargeM3s.set(m.ensembleIndex, t.meanAddedDischargeM3s);
  }
  return {
    addedVolumeM3: totals.addedVolumeM3,
    meanAddedDischargeM3s: totals.meanAddedDischargeM3s,
    addedDepthMm: totals.addedDepthMm,
    areaKm2: sum(variant.bands.map((b) => b.areaM2)) / 1e6,
    addedByPeriodM3,
    ensembleAddedM3,
    ensembleAddedDischargeM3s,
  };
}

/** The mean length of a Gregorian year, days: a multi-decade run's mean discharge spreads its volume over all its years. */
const GREGORIAN_YEAR_DAYS = 365.2425;

/**
 * A catchment's contribution from its multi-decade run: the added runoff of each year (variant
 * minus baseline, every source as it leaves the bands, as in a season run), their sum, and the
 * mean added discharge over all the run's years. Darkening draws glacier water earlier, so the
 * later years of a shrinking glacier can add less than nothing; the sum nets them.
 */
export function transientContribution(members: readonly TransientContributionMember[]): CatchmentContribution {
  const variant = members.find((m) => m.kind === 'scenario')?.summary;
  if (!variant) throw new RangeError('transientContribution: the run has no scenario member');
  const baseline = members.find((m) => m.kind === 'baseline')?.summary ?? variant;
  const runoff = (r: TransientSummary['years'][number]) => sum(SOURCES.map((s) => r.runoffM3[s]));
  const baseByYear = new Map(baseline.years.map((r) => [r.year, runoff(r)]));
  const addedByPeriodM3 = new Map(variant.years.map((r) => [String(r.year), runoff(r) - (baseByYear.get(r.year) ?? runoff(r))]));
  const addedVolumeM3 = sum(addedByPeriodM3.values());
  const areaM2 = sum(variant.bands.map((b) => b.areaM2));
  return {
    addedVolumeM3,
    meanAddedDischargeM3s: variant.years.length ? addedVolumeM3 / (variant.years.length * GREGORIAN_YEAR_DAYS * 86400) : 0,
    addedDepthMm: areaM2 > 0 ? (addedVolumeM3 / areaM2) * 1000 : 0,
    areaKm2: areaM2 / 1e6,
    addedByPeriodM3,
    ensembleAddedM3: new Map(),
    ensembleAddedDischargeM3s: new Map(),
  };
}

export interface RegionalTotal {
  /** Months or years, in order. */
  periods: string[];
  /** Per catchment (in the order given), added runoff in each of `periods`. */
  byCatchment: number[][];
  addedByPeriodM3: number[];
  addedVolumeM3: number;
  /** The sum of each catchment's mean added discharge (over its own melt season, or over a multi-decade run's years), m³ s⁻¹. */
  meanAddedDischargeM3s: number;
  /**
   * 5–95 % over the ensemble of the regional sum: member i of every catchment ran on the same
   * Latin hypercube parameter set (one seed for the study), so member i's regional total is the
   * sum of the catchments' members i. Null unless every catchment has the same members.
   */
  addedVolumeRangeM3: { p5: number; p50: number; p95: number } | null;
  meanAddedDischargeRangeM3s: { p5: number; p50: number; p95: number } | null;
  /** Catchment positions ranked by added volume, largest first. */
  ranking: number[];
}

function sharedEnsemble(contributions: readonly CatchmentContribution[], of: (c: CatchmentContribution) => Map<number, number>) {
  const indices = [...of(contributions[0]).keys()];
  if (indices.length === 0) return null;
  if (!contributions.every((c) => of(c).size === indices.length && indices.every((i) => of(c).has(i)))) return null;
  return band5to95(indices.map((i) => sum(contributions.map((c) => of(c).get(i)!))));
}

/** The regional total of the catchments' contributions to one scenario template. */
export function regionalTotal(contributions: readonly CatchmentContribution[]): RegionalTotal {
  const periods = [...new Set(contributions.flatMap((c) => [...c.addedByPeriodM3.keys()]))].sort();
  const byCatchment = contributions.map((c) => periods.map((p) => c.addedByPeriodM3.get(p) ?? 0));
  const ranking = contributions.map((_, i) => i).sort((a, b) => contributions[b].addedVolumeM3 - contributions[a].addedVolumeM3);
  return {
    periods,
    byCatchment,
    addedByPeriodM3: periods.map((_, k) => sum(byCatchment.map((row) => row[k]))),
    addedVolumeM3: sum(contributions.map((c) => c.addedVolumeM3)),
    meanAddedDischargeM3s: sum(contributions.map((c) => c.meanAddedDischargeM3s)),
    addedVolumeRangeM3: contributions.length ? sharedEnsemble(contributions, (c) => c.ensembleAddedM3) : null,
    meanAddedDischargeRangeM3s: contributions.length ? sharedEnsemble(contributions, (c) => c.ensembleAddedDischargeM3s) : null,
    ranking,
  };
}

/** 5–95 % of one catchment's ensemble added volume; null without an ensemble. */
export function contributionRange(c: CatchmentContribution): { p5: number; p50: number; p95: number } | null {
  return c.ensembleAddedM3.size > 0 ? band5to95([...c.ensembleAddedM3.values()]) : null;
}
