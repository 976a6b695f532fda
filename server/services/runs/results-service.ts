import { attributionDrivers } from '../../../shared/analysis/run-plan';
import { runResults } from '../../../shared/analysis/run-results';
import type { RunResults } from '../../../shared/schemas/results';
import { conflict } from '../../errors';
import { csvFile, type DownloadFile } from '../download-file';
import { readChanges } from './scenario-service';
import type { TenantScope } from '../tenant-scope';
import { bandMonthCsv, dailyCsv } from './results-csv';
import { loadMembers, type StoredMember } from './run-store';
import { toRun, type RunService } from './run-service';

/** Reads a finished run's stored members and derives the added-melt results and exports. */
export class ResultsService {
  constructor(private readonly runs: RunService) {}

  async results(scope: TenantScope, catchmentId: number, runId: number): Promise<RunResults> {
    return (await this.load(scope, catchmentId, runId)).results;
  }

  async bandMonthCsv(scope: TenantScope, catchmentId: number, runId: number): Promise<DownloadFile> {
    const { results, members } = await this.load(scope, catchmentId, runId);
    const variant = members.find((m) => m.kind === 'scenario')!.summary;
    const baseline = members.find((m) => m.kind === 'baseline')?.summary ?? variant;
    return csvFile(`run-${runId}-bands-by-month.csv`, bandMonthCsv(results, baseline, variant));
  }

  async dailyCsv(scope: TenantScope, catchmentId: number, runId: number): Promise<DownloadFile> {
    return csvFile(`run-${runId}-daily.csv`, dailyCsv(await this.results(scope, catchmentId, runId)));
  }

  private async load(scope: TenantScope, catchmentId: number, runId: number): Promise<{ results: RunResults; members: StoredMember[] }> {
    const row = await this.runs.row(scope, catchmentId, runId);
    if (row.status !== 'done') throw conflict(`This run is ${row.status}; results exist once it is done.`);
    const catchment = await scope.findOr404<{ name: string }>('catchments', catchmentId, 'Catchment');
    const members = await loadMembers(scope, runId);
    const bandElevations = members[0]?.summary.bands.map((b) => b.elevationM) ?? [];
    const drivers = row.baseline_changes ? attributionDrivers(readChanges(row.changes), readChanges(row.baseline_changes), bandElevations) : [];
    return { results: runResults(toRun(row), catchment.name, members, drivers), members };
  }
}
