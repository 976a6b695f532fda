import type { Knex } from 'knex';
import { DEFAULT_CALIBRATION_SET, type CalibrationSet } from '../../../shared/lab/calibration-set';
import type { DischargeEvaluation } from '../../../shared/lab/calibrate';
import type { LabTask } from '../../workers/lab-worker';
import type { ReferenceComparison } from '../../../shared/lab/reference-models';
import type { SurfaceResponseResult } from '../../../shared/lab/surface-response';
import type { StakeComparison } from '../../../shared/lab/stake-balance';
import { sweepCells, type SweepPlan } from '../../../shared/lab/sweep';
import type {
  BandQuery, CalibrationJobRequest, LabJob, SaveCalibrationRequest, SavedCalibration, SkillRequest, StakeSkillRequest, SurfaceResponse,
  SweepJobRequest,
} from '../../../shared/schemas/lab';
import { validationFailed } from '../../errors';
import type { UserRow } from '../auth/auth-service';
import type { BandService } from '../catchments/band-service';
import type { TenantScope } from '../tenant-scope';
import type { CalibrationStore } from './calibration-store';
import { LabData } from './lab-data';
import type { WaterServices } from '../water';
import { LabJobs } from './lab-jobs';
import { RemoteSensingLab } from './remote-sensing-lab';
import type { LabRunner } from './lab-queue';
import type { JobQueues } from '../../queue/job-queues';

/** Worker tasks per thread in a sweep: a few, so every thread stays busy to the end. */
const TASKS_PER_THREAD = 4;

/** The lab: surface response, reference models, skill scores, calibration and sweeps for a catchment. */
export class LabService {
  readonly data: LabData;
  readonly jobs: LabJobs;
  /** Snow-cover maps and the geodetic balance as calibration targets. */
  readonly remoteSensing: RemoteSensingLab;

  constructor(db: Knex, queues: JobQueues, bands: BandService, readonly pool: LabRunner, readonly calibrations: CalibrationStore, water: WaterServices) {
    this.data = new LabData(bands, water.waterInputs);
    this.jobs = new LabJobs(db, queues);
    this.remoteSensing = new RemoteSensingLab(this.data, pool, (scope, catchmentId) => this.calibratedParameters(scope, catchmentId));
  }

  /**
   * The calibrated parameters new scenarios start from: the newest saved set of the catchment, or
   * the engine's defaults (empty overrides, precipitation factor 1) when none was saved.
   */
  async calibratedParameters(scope: TenantScope, catchmentId: number): Promise<CalibrationSet> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    const current = await this.calibrations.current(scope, catchmentId);
    return current ? { parameters: current.set.parameters, precipitationFactor: current.set.precipitationFactor } : { ...DEFAULT_CALIBRATION_SET, parameters: {} };
  }

  async surfaceResponse(scope: TenantScope, catchmentId: number, query: BandQuery): Promise<SurfaceResponse> {
    const set = await this.calibratedParameters(scope, catchmentId);
    const period = { from: query.from, to: query.to };
    const site = await this.data.site(scope, catchmentId, period, set);
    const band = this.band(site.catchment.bands, query.band);
    const result = await this.pool.run<SurfaceResponseResult>({ kind: 'surface', site: { ...site, bandIndex: query.band, period } }, { organisationId: scope.organisationId });
    return {
      band: { index: query.band, lowerM: band.lowerM, upperM: band.upperM, debrisThicknessM: band.debrisThicknessM, glacierFraction: band.glacierFraction },
      period,
      set: { parameters: set.parameters as Record<string, number>, precipitationFactor: set.precipitationFactor },
      ...result,
    };
  }

  async referenceModels(scope: TenantScope, catchmentId: number, query: BandQuery): Promise<ReferenceComparison> {
    const set = await this.calibratedParameters(scope, catchmentId);
    const period = { from: query.from, to: query.to };
    const site = await this.data.site(scope, catchmentId, period, set);
    this.band(site.catchment.bands, query.band);
    return this.pool.run<ReferenceComparison>({ kind: 'reference', site: { ...site, bandIndex: query.band, period } }, { organisationId: scope.organisationId });
  }

  /** Skill of simulated against observed discharge, with the given set or the one in force. */
  async skill(scope: TenantScope, catchmentId: number, request: SkillRequest): Promise<{ set: CalibrationSet; evaluation: DischargeEvaluation }> {
    const set = request.set ?? await this.calibratedParameters(scope, catchmentId);
    return { set, evaluation: await this.evaluate(scope, catchmentId, request.period, set) };
  }

  /** Simulated against measured stake balances, with the given set or the one in force. */
  async stakeSkill(scope: TenantScope, catchmentId: number, request: StakeSkillRequest): Promise<{ set: CalibrationSet; comparison: StakeComparison }> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    const set = request.set ?? await this.calibratedParameters(scope, catchmentId);
    const observed = await this.data.observedStakes(scope, catchmentId);
    const record = await this.data.recordRange(scope, catchmentId);
    const inside = observed.filter((o) => record && o.from >= record.from && o.to <= record.to);
    if (!record || inside.length === 0) throw validationFailed('No stake reading falls inside the climate record.', 'stakes');
    const span = { from: inside.reduce((a, o) => (o.from < a ? o.from : a), inside[0].from), to: inside.reduce((a, o) => (o.to > a ? o.to : a), inside[0].to) };
    const site = await this.data.site(scope, catchmentId, span, set);
    const comparison = await this.pool.run<StakeComparison>({ kind: 'stakes', site, observed: inside }, { organisationId: scope.organisationId });
    return { set, comparison: { ...comparison, outsideRecord: observed.length - inside.length } };
  }

  /** The catchment's saved calibrations, newest (the one in force) first. */
  async calibrationHistory(scope: TenantScope, catchmentId: number): Promise<{ current: SavedCalibration | null; history: SavedCalibration[] }> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    const history = await this.calibrations.history(scope, catchmentId);
    return { current: history[0] ?? null, history };
  }

  async saveCalibration(scope: TenantScope, user: UserRow, catchmentId: number, request: SaveCalibrationRequest): Promise<SavedCalibration> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    const set: CalibrationSet = request.set;
    const evaluation = await this.evaluate(scope, catchmentId, request.period, set);
    return this.calibrations.save(scope, user, catchmentId, { set, period: request.period, note: request.note, scores: { daily: evaluation.daily, monthly: evaluation.monthly } });
  }

  /** The catchment's newest jobs, without their results. */
  async jobList(scope: TenantScope, catchmentId: number): Promise<LabJob[]> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    return this.jobs.list(scope, catchmentId);
  }

  async startSweep(scope: TenantScope, user: UserRow, catchmentId: number, request: SweepJobRequest): Promise<LabJob> {
    const plan: SweepPlan = request;
    const set = await this.calibratedParameters(scope, catchmentId);
    const site = await this.data.site(scope, catchmentId, plan.period, set);
    const cells = sweepCells(plan);
    const size = Math.ceil(cells.length / (this.pool.threads * TASKS_PER_THREAD));
    const chunks: number[][][] = [];
    for (let i = 0; i < cells.length; i += size) chunks.push(cells.slice(i, i + size).map((c) => c.values));
    return this.jobs.start(scope, user, catchmentId, 'sweep', plan, { shape: 'sweep', site, plan, chunks });
  }

  async startCalibration(scope: TenantScope, user: UserRow, catchmentId: number, request: CalibrationJobRequest): Promise<LabJob> {
    const start = await this.calibratedParameters(scope, catchmentId);
    const periods = [request.period, ...(request.validationPeriod ? [request.validationPeriod] : [])];
    const span = { from: periods.reduce((a, p) => (p.from < a ? p.from : a), request.period.from), to: periods.reduce((a, p) => (p.to > a ? p.to : a), request.period.to) };
    const site = await this.data.site(scope, catchmentId, span, start);
    const common = { site, keys: request.keys, start, period: request.period, validationPeriod: request.validationPeriod, maxEvaluations: request.maxEvaluations, seed: request.seed };
    const task: LabTask = request.target === 'snowCover' || request.target === 'geodetic'
      ? await this.remoteSensing.calibrationTask(scope, catchmentId, request, start)
      : request.target === 'stakes'
        ? { kind: 'calibrateStakes', ...common, observed: await this.data.observedStakes(scope, catchmentId) }
        : { kind: 'calibrate', ...common, observed: await this.data.observedDischarge(scope, catchmentId, span) };
    return this.jobs.start(scope, user, catchmentId, 'calibration', request, { shape: 'single', task, progress: { kind: 'evaluations', max: request.maxEvaluations } });
  }

  private async evaluate(scope: TenantScope, catchmentId: number, period: { from: string; to: string }, set: CalibrationSet): Promise<DischargeEvaluation> {
    const site = await this.data.site(scope, catchmentId, period, set);
    const observed = await this.data.observedDischarge(scope, catchmentId, period);
    try {
      return await this.pool.run<DischargeEvaluation>({ kind: 'skill', site, observed, period }, { organisationId: scope.organisationId });
    } catch (error) {
      throw validationFailed(`Skill scores cannot be computed: ${error instanceof Error ? error.message : String(error)}`, 'period');
    }
  }

  private band<T>(bands: T[], index: number): T {
    const band = bands[index];
    if (!band) throw validationFailed(`Band ${index} does not exist; the catchment has ${bands.length} band(s), numbered from 0.`, 'band');
    return band;
  }
}
