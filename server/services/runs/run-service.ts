import { planRun, RunPlanError } from '../../../shared/analysis/run-plan';
import { simulationSettings } from '../../../shared/analysis/variant-settings';
import { relativeFactor, withWaterSide, type RunWaterSide } from '../../../shared/analysis/water-side-inputs';
import { ENGINE_VERSION } from '../../../shared/melt/version';
import { parseSimulationInput, SimulationInputError } from '../../../shared/melt/prepare';
import { DEFAULT_RUN_START, type Run, type RunStart, type StartRunRequest, type TransientOptions } from '../../../shared/schemas/runs';
import { conflict, notFound, validationFailed } from '../../errors';
import type { ScenarioService } from './scenario-service';
import type { TenantScope } from '../tenant-scope';
import type { CatchmentInputs, CatchmentInputSource } from './catchment-inputs';
import { inputHash } from './input-hash';
import { transientInputs } from './transient-inputs';
import type { RunExecutor } from './run-executor';
import type { WaterInputSource } from '../water/water-inputs';

export interface RunRow {
  id: number;
  catchment_id: number;
  scenario_id: number;
  scenario_name: string;
  is_baseline: number | boolean;
  changes: string | object;
  baseline_changes: string | object | null;
  attribution: number | boolean;
  ensemble_size: number;
  ensemble_seed: number;
  status: Run['status'];
  progress: number;
  simulation_count: number;
  error_message: string | null;
  engine_version: string;
  input_hash: string;
  period_from: Date | string | null;
  period_to: Date | string | null;
  start_options: string | RunStart | null;
  water_side: string | RunWaterSide | null;
  transient_options: string | TransientOptions | null;
  queued_at: Date;
  started_at: Date | null;
  finished_at: Date | null;
}

/** The record a run's forcing needs before its period. */
const spanFor = (start: RunStart) => ({ spinUpYears: start.method === 'spin-up' ? start.years : 0 });

/** The water side a run was made with; null for runs made before it was recorded. */
export function readWaterSide(row: Pick<RunRow, 'water_side'>): RunWaterSide | null {
  return typeof row.water_side === 'string' ? JSON.parse(row.water_side) as RunWaterSide : row.water_side ?? null;
}

const iso = (v: Date | null) => (v ? new Date(v).toISOString() : null);
const day = (v: Date | string) => (v instanceof Date ? v.toISOString().slice(0, 10) : String(v).slice(0, 10));

export function toRun(row: RunRow): Run {
  return {
    id: row.id,
    catchmentId: row.catchment_id,
    scenarioId: row.scenario_id,
    scenarioName: row.scenario_name,
    isBaseline: Boolean(row.is_baseline),
    attribution: Boolean(row.attribution),
    ensembleSize: row.ensemble_size,
    status: row.status,
    progress: row.progress,
    simulationCount: row.simulation_count,
    errorMessage: row.error_message,
    engineVersion: row.engine_version,
    inputHash: row.input_hash,
    period: row.period_from && row.period_to ? { from: day(row.period_from), to: day(row.period_to) } : null,
    start: typeof row.start_options === 'string' ? JSON.parse(row.start_options) : row.start_options ?? null,
    transient: typeof row.transient_options === 'string' ? JSON.parse(row.transient_options) : row.transient_options ?? null,
    queuedAt: iso(row.queued_at)!,
    startedAt: iso(row.started_at),
    finishedAt: iso(row.finished_at),
  };
}

/** Starting, reading and cancelling runs; the simulating is the executor's. */
export class RunService {
  constructor(
    private readonly scenarios: ScenarioService,
    private readonly inputs: CatchmentInputSource,
    private readonly water: WaterInputSource,
    private readonly executor: RunExecutor,
  ) {}

  /**
   * Validates everything a run needs, then queues it — or returns the finished (or still running)
   * run with identical inputs instead of computing it again.
   */
  async start(scope: TenantScope, catchmentId: number, request: StartRunRequest, userId: number): Promise<{ run: Run; reused: boolean }> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    const scenario = await this.scenarios.get(scope, catchmentId, request.scenarioId);
    if (scenario.archived) throw validationFailed('This scenario is archived; restore it before running it.', 'scenarioId');
    const baseline = scenario.isBaseline ? null : await this.scenarios.baseline(scope, catchmentId);
    const settings = simulationSettings(scenario.changes, baseline?.changes ?? null);
    const { period } = settings;
    const water = await this.water.inputs(scope, catchmentId);
    const waterSide: RunWaterSide = { water, waterBalancePrecipitation: settings.waterBalancePrecipitation };
    if (settings.waterBalancePrecipitation && !water.closure) {
      throw validationFailed('changes.precipitationSource: this catchment has no saved water-balance precipitation; close its water balance in the lab and keep the result, or use the station record.', 'changes.precipitationSource');
    }
    const transient = request.transient ? await transientInputs(scope, catchmentId, request.transient, this.inputs, water) : null;
    const stored = transient?.stored ?? await this.inputs(scope, catchmentId, period, spanFor(request.start));
    if (request.start.method === 'initial-swe' && request.start.sweMm.length !== stored.catchment.bands.length) {
      throw validationFailed(`The snow water equivalent has ${request.start.sweMm.length} value(s); give one per band (${stored.catchment.bands.length}).`, 'start.sweMm');
    }
    const bandElevations = stored.catchment.bands.map((b) => (b.lowerM + b.upperM) / 2);
    let plan;
    try {
      plan = planRun({ changes: scenario.changes, baselineChanges: baseline?.changes ?? null, ...request }, bandElevations);
    } catch (error) {
      if (error instanceof RunPlanError) throw validationFailed(error.message, 'attribution');
      throw error;
    }
    // With the water-balance precipitation the closure's factor replaces the baseline's station factor; each member keeps its change relative to it.
    const reference = (baseline ?? scenario).changes.precipitationFactor;
    const members = plan.members.map((m) => {
      const scenarioInput = settings.waterBalancePrecipitation
        ? { ...m.input.scenario, precipitationFactor: relativeFactor(m.input.scenario.precipitationFactor, reference) } : m.input.scenario;
      const input = withWaterSide({ ...stored, ...m.input, scenario: scenarioInput, start: request.start, water }, settings.waterBalancePrecipitation);
      return { plan: m, input: transient ? { ...input, transient: transient.member } : input };
    });
    try {
      // The first member checks what all share (catchment, forcing, period); the rest differ only in validated changes.
      const firstYear = transient ? transient.member.periods[transient.member.years[0].recordYear] : undefined;
      parseSimulationInput({ ...members[0].input, parts: undefined, transient: undefined, ...(firstYear ? { period: firstYear } : {}) });
    } catch (error) {
      if (error instanceof SimulationInputError) throw validationFailed(`The inputs cannot be simulated: ${error.issues[0].path}: ${error.issues[0].message}`, error.issues[0].path, { issues: error.issues });
      throw error;
    }
    // Every member is the stored inputs plus its own changes: hash the stored part once.
    const hash = inputHash({
      engineVersion: ENGINE_VERSION, drivers: plan.drivers, stored, waterSide, start: request.start, transient: transient ? { options: request.transient, member: transient.member } : null,
      members: plan.members.map((m) => [m.key, m.input]),
    });
    // Within the catchment: a run is read back (and listed) under the catchment it was started for.
    const same = await scope.from<RunRow>('runs').where({ catchment_id: catchmentId, input_hash: hash }).whereIn('status', ['queued', 'running', 'done']).orderBy('id', 'desc').first();
    if (same) return { run: toRun(same), reused: true };

    const id = await scope.insert('runs', {
      catchment_id: catchmentId, scenario_id: scenario.id, scenario_name: scenario.name, is_baseline: scenario.isBaseline,
      changes: JSON.stringify(scenario.changes), baseline_changes: baseline ? JSON.stringify(baseline.changes) : null,
      attribution: request.attribution, ensemble_size: request.ensembleSize, ensemble_seed: request.ensembleSeed,
      status: 'queued', progress: 0, simulation_count: members.length, engine_version: ENGINE_VERSION, input_hash: hash,
      // A multi-decade run has years instead of a period.
      period_from: transient ? null : period?.from ?? null, period_to: transient ? null : period?.to ?? null,
      start_options: JSON.stringify(request.start), water_side: JSON.stringify(waterSide), transient_options: request.transient ? JSON.stringify(request.transient) : null, created_by: userId,
      // The band table version in use, which later saves leave in place for this run.
      band_table_id: scope.db.raw('(SELECT MAX(id) FROM band_tables WHERE catchment_id = ?)', [catchmentId]),
    });
    const run = await this.get(scope, catchmentId, id);
    this.executor.enqueue({ runId: id, organisationId: scope.organisationId, members });
    return { run, reused: false };
  }

  /** Stored catchment, forcing and water side for a period with the default spin-up, for the builder's in-browser preview. */
  async previewInputs(scope: TenantScope, catchmentId: number, period: { from: string; to: string }): Promise<CatchmentInputs & { water: RunWaterSide['water'] }> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    const water = await this.water.inputs(scope, catchmentId);
    return { ...(await this.inputs(scope, catchmentId, period, spanFor(DEFAULT_RUN_START))), water };
  }

  async get(scope: TenantScope, catchmentId: number, id: number): Promise<Run> {
    return toRun(await this.row(scope, catchmentId, id));
  }

  async row(scope: TenantScope, catchmentId: number, id: number): Promise<RunRow> {
    const row = await scope.findOr404<RunRow>('runs', id, 'Run');
    if (row.catchment_id !== catchmentId) throw notFound('Run');
    return row;
  }

  async list(scope: TenantScope, catchmentId: number): Promise<Run[]> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    const rows = await scope.from<RunRow>('runs').where('catchment_id', catchmentId).orderBy('id', 'desc').limit(200);
    return rows.map(toRun);
  }

  async cancel(scope: TenantScope, catchmentId: number, id: number): Promise<Run> {
    const row = await this.row(scope, catchmentId, id);
    if (row.status !== 'queued' && row.status !== 'running') throw conflict(`This run is already ${row.status}.`);
    if (!(await this.executor.cancel(id))) {
      // Not held by this process (e.g. left over from before a restart): close it here.
      await scope.from('runs').where('id', id).update({ status: 'cancelled', finished_at: scope.db.fn.now(3) });
    }
    return this.get(scope, catchmentId, id);
  }
}
