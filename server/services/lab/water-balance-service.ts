import { runoffDepthMm, stakeBandBalances, stakesForPeriod, statedMillimetresWe, statedPercent } from '../../../shared/lab/balance-observations';
import { stationCandidate, type ClosureTask } from '../../../shared/lab/water-balance-closure';
import type { BalanceUnknown } from '../../../shared/hydrology/water-balance';
import type { LabJob } from '../../../shared/schemas/lab';
import { waterBalanceClosureSchema, type SavedClosure, type WaterBalanceRequest } from '../../../shared/schemas/water-balance';
import { validationFailed } from '../../errors';
import type { UserRow } from '../auth/auth-service';
import type { DatasetRow } from '../catchments/dataset-service';
import { readDatasetValues, readStakeReadings } from '../catchments/dataset-values';
import { csvFile, type DownloadFile } from '../download-file';
import type { TenantScope } from '../tenant-scope';
import type { WaterServices } from '../water';
import { closureCsv } from '../water/closure-csv';
import type { LabService } from './lab-service';

/** Default stated accuracies where a record states none: 10 % of the runoff, 200 mm w.e. per stake (assumptions, said so in the result). */
const DEFAULT_RUNOFF_PERCENT = 10;
const DEFAULT_STAKE_MM = 200;
/** The inversion's budget of engine runs (36 were enough on the synthetic case). */
const MAX_EVALUATIONS = 80;

/**
 * The lab's water-balance calibration mode: the precipitation factor and profile that close the
 * catchment's balance against its measured runoff (and stakes), run as a lab job; a closed result
 * can be kept as the catchment's water-balance precipitation, which scenarios may then use.
 */
export class WaterBalanceService {
  constructor(private readonly lab: LabService, private readonly water: WaterServices) {}

  async start(scope: TenantScope, user: UserRow, catchmentId: number, request: WaterBalanceRequest): Promise<LabJob> {
    const set = await this.lab.calibratedParameters(scope, catchmentId);
    const site = await this.lab.data.site(scope, catchmentId, request.period, set);
    const task = await this.task(scope, catchmentId, request, site);
    return this.lab.jobs.start(scope, user, catchmentId, 'water-balance', request, {
      shape: 'single', task: { kind: 'waterBalance', site, task, maxEvaluations: MAX_EVALUATIONS }, progress: { kind: 'text', text: 'Closing the water balance: engine runs over the period' },
    });
  }

  async history(scope: TenantScope, catchmentId: number): Promise<{ current: SavedClosure | null; history: SavedClosure[] }> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    const history = await this.water.closures.history(scope, catchmentId);
    return { current: history[0] ?? null, history };
  }

  /** Keeps a finished closure of this catchment as its water-balance precipitation; one that did not close is refused. */
  async save(scope: TenantScope, user: UserRow, catchmentId: number, jobId: number, note: string): Promise<SavedClosure> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    const job = await this.lab.jobs.get(scope, jobId);
    if (job.catchmentId !== catchmentId || job.kind !== 'water-balance') throw validationFailed('jobId: choose a water-balance closure of this catchment.', 'jobId');
    if (job.status !== 'done') throw validationFailed(`jobId: this closure is ${job.status}; keep one that has finished.`, 'jobId');
    const closure = waterBalanceClosureSchema.parse(job.result);
    if (!closure.closed) throw validationFailed('jobId: this attempt did not close the water balance, so it cannot stand for the catchment\'s precipitation; see its messages.', 'jobId');
    return this.water.closures.save(scope, user, catchmentId, closure, note);
  }

  /** The catchment's current water-balance precipitation as CSV. */
  async csvFile(scope: TenantScope, catchmentId: number): Promise<DownloadFile> {
    const current = await this.water.closures.current(scope, catchmentId);
    if (!current) throw validationFailed('This catchment has no kept water-balance closure yet.', 'closure');
    const catchment = await scope.findOr404<{ name: string }>('catchments', catchmentId, 'Catchment');
    return csvFile(`catchment-${catchmentId}-water-balance.csv`, closureCsv(catchment.name, current));
  }

  /** The observations with their stated accuracy, and where the search starts. */
  private async task(scope: TenantScope, catchmentId: number, request: WaterBalanceRequest, site: Awaited<ReturnType<LabService['data']['site']>>): Promise<ClosureTask> {
    const scale = request.accuracyMeaning === 'two-sigma' ? 0.5 : 1;
    const notes: string[] = [];
    const gauge = await scope.from<DatasetRow>('datasets').where({ catchment_id: catchmentId, variable: 'discharge' }).orderBy('id', 'desc').first();
    if (!gauge) throw validationFailed('discharge: the catchment has no measured runoff; upload the outlet\'s daily discharge first.', 'discharge');
    const values = await readDatasetValues(scope.db, { datasetId: gauge.id, organisationId: scope.organisationId }, { from: `${request.period.from} 00:00`, to: `${request.period.to} 23:59` });
    const area = site.catchment.bands.reduce((s, b) => s + b.areaKm2, 0);
    let runoff;
    try {
      runoff = runoffDepthMm(values.map((v) => ({ date: v.t.slice(0, 10), value: v.value })), request.period, area);
    } catch (error) {
      if (error instanceof RangeError) throw validationFailed(error.message, 'period');
      throw error;
    }
    if (runoff.filledDays > 0) notes.push(`${runoff.filledDays} of the ${runoff.days} days had no gauge reading and were bridged by linear interpolation.`);
    const statedRunoff = request.runoffUncertaintyPercent ?? statedPercent(gauge.accuracy);
    if (statedRunoff === null) notes.push(`The discharge record states no accuracy; ±${DEFAULT_RUNOFF_PERCENT} % was assumed.`);
    const runoffSigma = ((statedRunoff ?? DEFAULT_RUNOFF_PERCENT) / 100) * scale * runoff.valueMm;

    let stakes: ReturnType<typeof stakeBandBalances> = { bandBalances: [], observed: [], notes: [] };
    if (request.useStakes) {
      const stakeRow = await scope.from<DatasetRow>('datasets').where({ catchment_id: catchmentId, variable: 'pointBalance' }).orderBy('id', 'desc').first();
      if (stakeRow) {
        const inPeriod = stakesForPeriod(await readStakeReadings(scope.db, { datasetId: stakeRow.id, organisationId: scope.organisationId }), request.period);
        const statedStake = request.stakeUncertaintyMm ?? statedMillimetresWe(stakeRow.accuracy);
        if (inPeriod.length === 0) notes.push('No stake reading covers this period (readings count when they start and end within 15 days of it), so only the runoff closes the balance.');
        else if (statedStake === null) notes.push(`The stake record states no accuracy; ±${DEFAULT_STAKE_MM} mm w.e. per stake was assumed.`);
        stakes = stakeBandBalances(inPeriod, site.catchment.bands, (statedStake ?? DEFAULT_STAKE_MM) * scale);
        notes.push(...stakes.notes);
      }
    }
    const unknowns = request.unknowns as BalanceUnknown[];
    const observationCount = 1 + stakes.bandBalances.length;
    if (unknowns.length > observationCount) {
      throw validationFailed(`unknowns: ${unknowns.length} quantities need at least as many observations; there ${observationCount === 1 ? 'is only the runoff' : `are ${observationCount} (runoff and ${stakes.bandBalances.length} stake bands)`}. Find fewer quantities or add stake readings for the period.`, 'unknowns');
    }
    return {
      period: request.period, form: request.form, unknowns, notes,
      observations: { runoffMm: { value: runoff.valueMm, uncertainty: runoffSigma }, ...(stakes.bandBalances.length ? { bandBalances: stakes.bandBalances } : {}) },
      station: stationCandidate(site, request.form),
      observed: {
        runoff: { value: runoff.valueMm, uncertainty: runoffSigma, days: runoff.days, filledDays: runoff.filledDays, source: gauge.file_name || `discharge dataset ${gauge.id}` },
        bandBalances: stakes.observed,
      },
    };
  }
}
