import {
  SCENARIO_SCHEMA_VERSION, scenarioChangesSchema, type ScenarioChanges, type ScenarioRecord, type ScenarioSetup,
} from '../../../shared/schemas/scenarios';
import type { z } from 'zod';
import type { scenarioCreateSchema, scenarioUpdateSchema } from '../../../shared/schemas/scenarios';
import { conflict, notFound, validationFailed } from '../../errors';
import type { CalibrationStore } from '../lab/calibration-store';
import type { TenantScope } from '../tenant-scope';
import { climateRecord } from './climate-record';
import type { ClosureStore } from '../water/closure-store';
import { defaultSeason } from '../../../shared/analysis/default-season';
import { RETIRED_PARAMETER_NAMES } from '../../../shared/melt/parameters';

interface ScenarioRow {
  id: number;
  catchment_id: number;
  name: string;
  description: string;
  is_baseline: number | boolean;
  schema_version: number;
  changes: string | object;
  archived_at: Date | null;
  created_at: Date;
  updated_at: Date;
}

/**
 * Stored changes as the current schema reads them. Scenarios were converted by migration; runs
 * keep the changes they were made with, so a version 1 run's changes are read as engine 1.x ran
 * them — loads on pristine snow (no background), no dry deposition, retired parameters dropped.
 */
export function readChanges(raw: string | object): ScenarioChanges {
  const stored = (typeof raw === 'string' ? JSON.parse(raw) : structuredClone(raw)) as Record<string, unknown> & { parameters?: Record<string, number> };
  if (stored.schemaVersion === 1) {
    stored.schemaVersion = SCENARIO_SCHEMA_VERSION;
    for (const name of RETIRED_PARAMETER_NAMES) delete stored.parameters?.[name];
  }
  return scenarioChangesSchema.parse(stored);
}

function toScenario(row: ScenarioRow): ScenarioRecord {
  return {
    id: row.id,
    catchmentId: row.catchment_id,
    name: row.name,
    description: row.description,
    isBaseline: Boolean(row.is_baseline),
    archived: row.archived_at !== null,
    changes: readChanges(row.changes),
    createdAt: new Date(row.created_at).toISOString(),
    updatedAt: new Date(row.updated_at).toISOString(),
  };
}

/** Scenarios of a catchment: its baseline (made with the catchment) and any number of variants. */
export class ScenarioService {
  constructor(private readonly calibrations: CalibrationStore, private readonly closures: ClosureStore) {}

  async list(scope: TenantScope, catchmentId: number, includeArchived: boolean): Promise<ScenarioRecord[]> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    const query = scope.from<ScenarioRow>('scenarios').where('catchment_id', catchmentId).orderBy([{ column: 'is_baseline', order: 'desc' }, 'name']);
    if (!includeArchived) query.whereNull('archived_at');
    return (await query).map(toScenario);
  }

  async get(scope: TenantScope, catchmentId: number, id: number): Promise<ScenarioRecord> {
    const row = await scope.findOr404<ScenarioRow>('scenarios', id, 'Scenario');
    if (row.catchment_id !== catchmentId) throw notFound('Scenario');
    return toScenario(row);
  }

  /** The catchment's baseline: no changes to the station record unless set; created with the catchment. */
  async baseline(scope: TenantScope, catchmentId: number): Promise<ScenarioRecord> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    const row = await scope.from<ScenarioRow>('scenarios').where({ catchment_id: catchmentId, is_baseline: true }).first();
    if (!row) throw notFound('Baseline scenario');
    return toScenario(row);
  }

  /**
   * What the scenario builder starts from: the stored climate record, its latest full melt season
   * the catchment's newest saved calibration and the background loads snow loads are added to.
   */
  async setup(scope: TenantScope, catchmentId: number): Promise<ScenarioSetup> {
    const catchment = await scope.findOr404<{ latitude_deg: number; background_black_carbon_ng_g: number; background_dust_ug_g: number }>('catchments', catchmentId, 'Catchment');
    const record = await climateRecord(scope, catchmentId);
    const saved = await this.calibrations.current(scope, catchmentId);
    const calibration = saved
      ? { parameters: saved.set.parameters, precipitationFactor: saved.set.precipitationFactor, savedBy: saved.savedBy, savedAt: saved.savedAt }
      : null;
    const closure = await this.closures.current(scope, catchmentId);
    const waterBalance = closure ? {
      precipitationFactor: closure.closure.candidate.precipitationFactor, ratio: closure.closure.precipitationRatio.value,
      period: closure.closure.period, savedBy: closure.savedBy, savedAt: closure.savedAt,
    } : null;
    return {
      record, defaultPeriod: record ? defaultSeason(record, catchment.latitude_deg) : null, calibration, waterBalance,
      background: { blackCarbonSnowNgG: catchment.background_black_carbon_ng_g, dustSnowUgG: catchment.background_dust_ug_g },
    };
  }

  async create(scope: TenantScope, catchmentId: number, body: z.output<typeof scenarioCreateSchema>, userId: number): Promise<ScenarioRecord> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    await this.assertNameFree(scope, catchmentId, body.name);
    const id = await scope.insert('scenarios', {
      catchment_id: catchmentId, name: body.name, description: body.description, is_baseline: false,
      schema_version: SCENARIO_SCHEMA_VERSION, changes: JSON.stringify(body.changes), created_by: userId,
    });
    return this.get(scope, catchmentId, id);
  }

  async update(scope: TenantScope, catchmentId: number, id: number, body: z.output<typeof scenarioUpdateSchema>): Promise<ScenarioRecord> {
    const current = await this.get(scope, catchmentId, id);
    if (body.name !== undefined) await this.assertNameFree(scope, catchmentId, body.name, id);
    if (current.isBaseline && body.archived) throw validationFailed('The baseline cannot be archived; variants are compared with it.', 'archived');
    await scope.from('scenarios').where('id', id).update({
      ...(body.name !== undefined ? { name: body.name } : {}),
      ...(body.description !== undefined ? { description: body.description } : {}),
      ...(body.changes ? { changes: JSON.stringify(body.changes), schema_version: SCENARIO_SCHEMA_VERSION } : {}),
      ...(body.archived !== undefined ? { archived_at: body.archived ? scope.db.fn.now() : null } : {}),
      updated_at: scope.db.fn.now(),
    });
    return this.get(scope, catchmentId, id);
  }

  /** A copy named "<name> (copy)", "<name> (copy 2)", … as a variant. */
  async duplicate(scope: TenantScope, catchmentId: number, id: number, userId: number): Promise<ScenarioRecord> {
    const source = await this.get(scope, catchmentId, id);
    const taken = new Set((await scope.from('scenarios').where('catchment_id', catchmentId).pluck('name')) as string[]);
    let name = `${source.name} (copy)`.slice(0, 120);
    for (let n = 2; taken.has(name); n++) name = `${source.name} (copy ${n})`.slice(0, 120);
    return this.create(scope, catchmentId, { name, description: source.description, changes: source.changes }, userId);
  }

  private async assertNameFree(scope: TenantScope, catchmentId: number, name: string, exceptId = 0): Promise<void> {
    const clash = await scope.from('scenarios').where({ catchment_id: catchmentId, name }).whereNot('id', exceptId).first('id');
    if (clash) throw conflict('This catchment already has a scenario with this name.', 'name');
  }
}
