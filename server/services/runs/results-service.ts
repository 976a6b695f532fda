import { attributionDrivers } from '../../../shared/analysis/run-plan';
import { baselineSkill } from '../../../shared/analysis/baseline-skill';
import { runResults, type ResultContext } from '../../../shared/analysis/run-results';
import { calibrationStatus } from '../../../shared/analysis/run-set-up';
import { dailyOutletM3 } from '../../../shared/analysis/simulation-summary';
import { waterSideLines } from '../../../shared/analysis/water-side-set-up';
import { simulationSettings } from '../../../shared/analysis/variant-settings';
import { addDays } from '../../../shared/melt/calendar';
import type { RunResults } from '../../../shared/schemas/results';
import type { ScenarioChanges } from '../../../shared/schemas/scenarios';
import { conflict } from '../../errors';
import type { DatasetRow } from '../catchments/dataset-service';
import { readDatasetValues } from '../catchments/dataset-values';
import { csvFile, type DownloadFile } from '../download-file';
import type { CalibrationStore } from '../lab/calibration-store';
import { readChanges } from './scenario-service';
import type { TenantScope } from '../tenant-scope';
import { bandMonthCsv, dailyCsv, yearsCsv } from './results-csv';
import { loadMembers, loadTransientMembers, type StoredMember } from './run-store';
import { initialGlacierLine, transientLine, transientResults } from '../../../shared/analysis/transient-results';
import type { TransientResults } from '../../../shared/schemas/transient-results';
import { SHORTWAVE_SOURCE_LABELS, START_LABELS } from '../../../shared/analysis/run-set-up';
import { readWaterSide, toRun, type RunRow, type RunService } from './run-service';

const ICE_LOADS = ['blackCarbonIceNgG', 'dustIceUgG'] as const;
const nonZero = (v: number | number[]) => (Array.isArray(v) ? v.some((x) => x !== 0) : v !== 0);
const darkensIce = (c: ScenarioChanges) =>
  ICE_LOADS.some((k) => nonZero(c[k])) || c.impuritiesByElevation.some((r) => ICE_LOADS.some((k) => r[k] !== undefined && nonZero(r[k]!)));

/** Reads a finished run's stored members and derives the added-melt results and exports. */
export class ResultsService {
  constructor(private readonly runs: RunService, private readonly calibrations: CalibrationStore) {}

  async results(scope: TenantScope, catchmentId: number, runId: number): Promise<RunResults> {
    return (await this.load(scope, catchmentId, runId)).results;
  }

  /** A multi-decade run's results, year by year. */
  async transient(scope: TenantScope, catchmentId: number, runId: number): Promise<TransientResults> {
    const row = await this.finishedRow(scope, catchmentId, runId);
    const run = toRun(row);
    if (!run.transient) throw conflict('This is a season run; its results are by day and month, not by year.');
    const catchment = await scope.findOr404<{ name: string }>('catchments', catchmentId, 'Catchment');
    const members = await loadTransientMembers(scope, runId);
    const changes = readChanges(row.changes);
    const baselineChanges = row.baseline_changes ? readChanges(row.baseline_changes) : null;
    const context = await this.context(scope, catchmentId, row, null, changes, baselineChanges);
    const first = (members.find((m) => m.kind === 'baseline') ?? members[0]).summary.years[0];
    const side = readWaterSide(row);
    const setUp = {
      start: first && members[0].summary.start ? { label: START_LABELS[members[0].summary.start.method], note: members[0].summary.start.note, adequate: members[0].summary.start.adequate } : null,
      shortwaveSource: members[0]?.summary.shortwaveSource ? SHORTWAVE_SOURCE_LABELS[members[0].summary.shortwaveSource] : null,
      calibration: context.calibration,
      skill: null,
      waterSide: [
        transientLine(run.transient, members[0].summary.years.map((y) => y.recordYear)),
        ...(side && first ? [initialGlacierLine(side.water.glacier, first.glacierAreaKm2, first.glacierVolumeKm3)] : []),
        ...context.waterSide,
      ],
    };
    return transientResults(run, catchment.name, members, { setUp, iceDarkened: context.iceDarkened });
  }

  async yearsCsv(scope: TenantScope, catchmentId: number, runId: number): Promise<DownloadFile> {
    return csvFile(`run-${runId}-years.csv`, yearsCsv(await this.transient(scope, catchmentId, runId)));
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

  private async finishedRow(scope: TenantScope, catchmentId: number, runId: number): Promise<RunRow> {
    const row = await this.runs.row(scope, catchmentId, runId);
    if (row.status !== 'done') throw conflict(`This run is ${row.status}; results exist once it is done.`);
    return row;
  }

  private async load(scope: TenantScope, catchmentId: number, runId: number): Promise<{ results: RunResults; members: StoredMember[] }> {
    const row = await this.finishedRow(scope, catchmentId, runId);
    if (row.transient_options) throw conflict('This is a multi-decade run; its results are year by year (see its years).');
    const catchment = await scope.findOr404<{ name: string }>('catchments', catchmentId, 'Catchment');
    const members = await loadMembers(scope, runId);
    const bandElevations = members[0]?.summary.bands.map((b) => b.elevationM) ?? [];
    const changes = readChanges(row.changes);
    const baselineChanges = row.baseline_changes ? readChanges(row.baseline_changes) : null;
    const drivers = baselineChanges ? attributionDrivers(changes, baselineChanges, bandElevations) : [];
    const context = await this.context(scope, catchmentId, row, members, changes, baselineChanges);
    return { results: runResults(toRun(row), catchment.name, members, drivers, context), members };
  }

  /** The calibration check and the baseline's skill against the newest observed discharge. */
  /** Without season members (a multi-decade run) there is no baseline skill to score. */
  private async context(scope: TenantScope, catchmentId: number, row: RunRow, members: StoredMember[] | null, changes: ScenarioChanges, baselineChanges: ScenarioChanges | null): Promise<ResultContext> {
    const { parameters } = simulationSettings(changes, baselineChanges);
    const saved = await this.calibrations.current(scope, catchmentId);
    const calibration = calibrationStatus(parameters, (baselineChanges ?? changes).precipitationFactor, saved && {
      parameters: saved.set.parameters, precipitationFactor: saved.set.precipitationFactor, period: saved.period,
      kge: saved.scores.daily.kge, savedAt: saved.savedAt, savedBy: saved.savedBy,
    });
    const baseline = members && (members.find((m) => m.kind === 'baseline') ?? members.find((m) => m.kind === 'scenario'))!.summary;
    const discharge = await scope.from<DatasetRow>('datasets').where({ catchment_id: catchmentId, variable: 'discharge' }).orderBy('id', 'desc').first();
    let skill: ResultContext['skill'] = null;
    if (discharge && baseline) {
      const last = addDays(baseline.startDate, baseline.dayCount - 1);
      const values = await readDatasetValues(scope.db, { datasetId: discharge.id, organisationId: scope.organisationId }, { from: `${baseline.startDate} 00:00`, to: `${last} 23:59` });
      const observed = values.map((v) => ({ date: v.t.slice(0, 10), value: v.value }));
      // Scored at the outlet: routed through the catchment's stores where the run routed its runoff.
      skill = baselineSkill(observed, baseline.startDate, dailyOutletM3(baseline).map((v) => v / 86_400), discharge.file_name || `discharge dataset ${discharge.id}`, baseline.routedDailyM3 !== null);
    }
    return { calibration, skill, iceDarkened: darkensIce(changes), waterSide: waterSideLines(readWaterSide(row)) };
  }
}
