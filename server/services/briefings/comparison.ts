import type { Headline, RunSelection } from '../../../shared/schemas/briefings';
import type { TenantScope } from '../tenant-scope';

/** One band in one month of a stored run: melt by surface and runoff, m³ (as the runs store them). */
export interface BandMonthVolumes {
  bandIndex: number;
  /** YYYY-MM */
  month: string;
  snowMeltM3: number;
  iceMeltM3: number;
  debrisIceMeltM3: number;
  runoffM3: number;
}

/** What a briefing needs of one stored run. */
export interface RunForBriefing {
  id: number;
  scenarioName: string;
  /** Scenario values in plain words, e.g. { label: 'Black carbon in snow', value: '150 ng/g' }. */
  scenarioValues: { label: string; value: string }[];
  engineVersion: string;
  inputHash: string;
  finishedAt: string;
  /** Members of the parameter ensemble behind the ranges; 1 without an ensemble. */
  ensembleSize: number;
  bandMonths: BandMonthVolumes[];
  /** Catchment mean daily discharge, m³/s, from `startDate`; low/high = 5–95 % of the ensemble. */
  daily: { startDate: string; dischargeM3s: number[]; low?: number[]; high?: number[] };
}

/** A variant run with its headline numbers against the baseline (computed by the results service). */
export interface VariantForBriefing extends RunForBriefing {
  headline: Omit<Headline, 'variantName'>;
}

/** Everything about the chosen runs that a briefing version copies into its snapshot. */
export interface ComparisonForBriefing {
  period: { from: string; to: string };
  bands: { label: string; areaKm2: number }[];
  baseline: RunForBriefing;
  variants: VariantForBriefing[];
  parameters: { label: string; value: string }[];
  dataSources: { name: string; variables: string; source: string; accuracy: string }[];
}

/** Reads the chosen runs of a catchment; throws a 404/422 AppError for runs that are missing or not finished. */
export interface BriefingResultsSource {
  load(scope: TenantScope, catchmentId: number, selection: RunSelection): Promise<ComparisonForBriefing>;
}
