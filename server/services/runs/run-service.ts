import { planRun, RunPlanError } from '../../../shared/analysis/run-plan';
import { simulationSettings } from '../../../shared/analysis/variant-settings';
import type { RunWaterSide } from '../../../shared/analysis/water-side-inputs';
import { ENGINE_VERSION } from '../../../shared/melt/version';
import { parseSimulationInput, SimulationInputError } from '../../../shared/melt/prepare';
import { DEFAULT_RUN_START, FINISHED_STATUSES, type Run, type RunStart, type StartRunRequest, type TransientOptions } from '../../../shared/schemas/runs';
import { conflict, notFound, validationFailed } from '../../errors';
import type { ScenarioService } from './scenario-service';
import type { TenantScope } from '../tenant-scope';
import type { CatchmentInputs, CatchmentInputSource } from './catchment-inputs';
import { inputHash } from './input-hash';
import type { JobPriority } from '../../queue/jobs';
import type { WaterInputSource } from '../water/water-inputs';
import { memberInput, saveRunInputs, type RunInputs } from './run-inputs';
import type { RunQueue } from './run-queue';
import { transientInputs } from './transient-inputs';

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

/** Starting, reading and cancelling runs; the simulating is the worker processes' (through the queue). */
export class RunService {
  constructor(
    private readonly scenarios: ScenarioService,
    private readonly inputs: CatchmentInputSource,
    private readonly water: WaterInputSource,
    private readonly queue: RunQueue,
  ) {}

  /**
   * Validates everything a run needs, stores it with its inputs and queues its members — or
   * returns the finished (or still running) run with identical inputs instead of computing it
   * again. `priority` places its jobs: a run started on its own goes ahead of a study's.
   */
  async start(scope: TenantScope, catchmentId: number, request: StartRunRequest, userId: number, priority: JobPriority = 'run'): Promise<{ run: Run; reused: boolean }> {
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
    const runInputs: RunInputs = {
      stored, start: request.start, plans: plan.members, waterSide,
      referencePrecipitationFactor: (baseline ?? scenario).changes.precipitationFactor, transient: transient?.member ?? null,
    };
    try {
      // The first member checks what all share (catchment, forcing, period); the rest differ only in validated changes.
      const firstYear = transient ? transient.member.periods[transient.member.years[0].recordYear] : undefined;
      parseSimulationInput({ ...memberInput(runInputs, 0), parts: undefined, transient: undefined, ...(firstYear ? { period: firstYear } : {}) });
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

    const id = await scope.transaction(async (s) => {
      const runId = await s.insert('runs', {
        catchment_id: catchmentId, scenario_id: scenario.id, scenario_name: scenario.name, is_baseline: scenario.isBaseline,
        changes: JSON.stringify(scenario.changes), baseline_changes: baseline ? JSON.stringify(baseline.changes) : null,
        attribution: request.attribution, ensemble_size: request.ensembleSize, ensemble_seed: request.ensembleSeed,
        status: 'queued', progress: 0, simulation_count: plan.members.length, engine_version: ENGINE_VERSION, input_hash: hash,
        // A multi-decade run has years instead of a period.
        period_from: transient ? null : period?.from ?? null, period_to: transient ? null : period?.to ?? null,
        start_options: JSON.stringify(request.start), water_side: JSON.stringify(waterSide), transient_options: request.transient ? JSON.stringify(request.transient) : null, created_by: userId,
        // The band table version in use, which later saves leave in place for this run.
        band_table_id: s.db.raw('(SELECT MAX(id) FROM band_tables WHERE catchment_id = ?)', [catchmentId]),
      });
      await saveRunInputs(s, runId, runInputs);
      return runId;
    });
    await this.queue.enqueue({ runId: id, organisationId: scope.organisationId, memberCount: plan.members.length, priority });
    return { run: await this.get(scope, catchmentId, id), reused: false };
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

  /** The run once it has ended (done, failed or cancelled), or as it is after `timeoutMs` (seeds and scripts wait on the workers with this). */
  async finished(scope: TenantScope, catchmentId: number, id: number, timeoutMs: number): Promise<Run> {
    const until = Date.now() + timeoutMs;
    for (;;) {
      const run = await this.get(scope, catchmentId, id);
      if (FINISHED_STATUSES.includes(run.status) || Date.now() > until) return run;
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
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
    await this.cancelOpen(scope, [id]);
    return this.get(scope, catchmentId, id);
  }

  /** Cancels those of the runs still queued or running: marked first, so no worker stores more of them, then their jobs stopped. */
  async cancelOpen(scope: TenantScope, runIds: number[]): Promise<void> {
    if (runIds.length === 0) return;
    const open: Pick<RunRow, 'id' | 'simulation_count'>[] = await scope.from<RunRow>('runs').whereIn('id', runIds).whereIn('status', ['queued', 'running']).select('id', 'simulation_count');
    if (open.length === 0) return;
    await scope.from('runs').whereIn('id', open.map((r) => r.id)).whereIn('status', ['queued', 'running'])
      .update({ status: 'cancelled', finished_at: scope.db.fn.now(3) });
    await this.queue.stop(open.map((r) => ({ runId: r.id, memberCount: r.simulation_count })));
  }
}
