import type { RunSelection } from '../../../shared/schemas/briefings';
import type { RunResults } from '../../../shared/schemas/results';
import type { TenantScope } from '../tenant-scope';

/** One chosen variant run: its results against its paired baseline (from the results service) and its scenario in words. */
export interface BriefingRun {
  results: RunResults;
  /** e.g. { label: 'Black carbon in snow', value: '150 ng/g' } */
  scenarioValues: { label: string; value: string }[];
}

/** Everything about the chosen runs that a briefing version copies into its snapshot. */
export interface ComparisonForBriefing {
  baselineName: string;
  baselineValues: { label: string; value: string }[];
  runs: BriefingRun[];
  parameters: { label: string; value: string }[];
  dataSources: { name: string; variables: string; source: string; accuracy: string }[];
}

/** Reads the chosen runs of a catchment; throws an AppError for runs that are missing, not finished or not comparable. */
export interface BriefingResultsSource {
  /** Refuses, by field, runs that are missing, not finished or baseline runs (cheap: no results are read). */
  check(scope: TenantScope, catchmentId: number, selection: RunSelection): Promise<void>;
  load(scope: TenantScope, catchmentId: number, selection: RunSelection): Promise<ComparisonForBriefing>;
}
