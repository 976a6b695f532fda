import { parameterValues, scenarioValues } from '../../../shared/briefings/scenario-values';
import { variableSpec, type Variable } from '../../../shared/schemas/dataset-variables';
import { samePeriodAsFirst } from '../../../shared/analysis/compare-periods';
import type { RunSelection } from '../../../shared/schemas/briefings';
import { validationFailed } from '../../errors';
import type { ResultsService } from '../runs/results-service';
import type { RunRow } from '../runs/run-service';
import { BASELINE_NAME } from '../../../shared/schemas/scenarios';
import { readChanges } from '../runs/scenario-service';
import type { TenantScope } from '../tenant-scope';
import type { BriefingResultsSource, ComparisonForBriefing } from './comparison';

interface DatasetRow { variable: string; kind: string; source: string; accuracy: string; file_name: string; station_name: string | null }

/** Briefing numbers from finished runs, through the results service (so briefings and results screens agree). */
export class RunsResultsSource implements BriefingResultsSource {
  constructor(private readonly results: ResultsService) {}

  async check(scope: TenantScope, catchmentId: number, selection: RunSelection): Promise<void> {
    await this.variantRows(scope, catchmentId, selection);
  }

  private async variantRows(scope: TenantScope, catchmentId: number, selection: RunSelection): Promise<RunRow[]> {
    const rows: RunRow[] = [];
    for (const [i, runId] of selection.runIds.entries()) {
      const field = `selection.runIds.${i}`;
      const row = await scope.from('runs').where({ id: runId, catchment_id: catchmentId }).first() as RunRow | undefined;
      if (!row) throw validationFailed(`Run #${runId} is not a run of this catchment.`, field);
      if (row.status !== 'done') throw validationFailed(`Run #${runId} is ${row.status}; only finished runs can be reported.`, field);
      if (row.transient_options) {
        throw validationFailed(`Run #${runId} is a multi-decade run; a briefing compares season runs (its results and CSV are on its own page).`, field);
      }
      if (row.is_baseline || !row.baseline_changes) {
        throw validationFailed(`Run #${runId} is a baseline run; choose variant runs (each carries its baseline).`, field);
      }
      rows.push(row);
    }
    return rows;
  }

  async load(scope: TenantScope, catchmentId: number, selection: RunSelection): Promise<ComparisonForBriefing> {
    const picked = [];
    for (const row of await this.variantRows(scope, catchmentId, selection)) {
      picked.push({ row, results: await this.results.results(scope, catchmentId, row.id) });
    }
    const first = picked[0];
    const [mismatch] = samePeriodAsFirst(picked).left;
    if (mismatch) {
      throw validationFailed(
        `Run #${mismatch.row.id} covers ${mismatch.results.startDate} + ${mismatch.results.dayCount} days, run #${first.row.id} ${first.results.startDate} + ${first.results.dayCount} days; a briefing compares runs over the same period.`,
        'selection.runIds',
      );
    }
    const datasets = (await scope.from('datasets').leftJoin('stations', 'stations.id', 'datasets.station_id').where('datasets.catchment_id', catchmentId)
      .orderBy(['datasets.kind', 'datasets.variable', 'stations.elevation_m'])
      .select('datasets.variable', 'datasets.kind', 'datasets.source', 'datasets.accuracy', 'datasets.file_name', 'stations.name as station_name')) as DatasetRow[];
    const firstChanges = readChanges(first.row.changes);
    return {
      baselineName: BASELINE_NAME,
      baselineValues: scenarioValues(readChanges(first.row.baseline_changes!)),
      runs: picked.map((p) => ({ results: p.results, scenarioValues: scenarioValues(readChanges(p.row.changes)) })),
      parameters: parameterValues(firstChanges.parameters),
      dataSources: datasets.map((d) => ({
        name: `${d.station_name ? `${d.station_name}: ` : ''}${d.file_name || variableSpec(d.variable as Variable).label}`,
        variables: `${variableSpec(d.variable as Variable).label} (${d.kind})`,
        source: d.source,
        accuracy: d.accuracy || 'not stated',
      })),
    };
  }
}
