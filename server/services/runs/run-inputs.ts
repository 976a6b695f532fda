import { deserialize, serialize } from 'node:v8';
import { gunzipSync, gzipSync } from 'node:zlib';
import type { Knex } from 'knex';
import type { MemberPlan } from '../../../shared/analysis/run-plan';
import type { MemberInput } from '../../../shared/analysis/simulate-summary';
import type { TransientMemberPlan } from '../../../shared/analysis/transient-member';
import { NO_WATER_SIDE, relativeFactor, withWaterSide, type RunWaterSide } from '../../../shared/analysis/water-side-inputs';
import type { RunStart } from '../../../shared/schemas/runs';
import type { TenantScope } from '../tenant-scope';
import type { CatchmentInputs } from './catchment-inputs';

/**
 * Everything a run's members are simulated from: the stored part, the water side and (for a
 * multi-decade run) the years and starting glacier once, each member's plan beside them.
 */
export interface RunInputs {
  stored: CatchmentInputs;
  start: RunStart;
  plans: MemberPlan[];
  waterSide: RunWaterSide;
  /** The station precipitation factor the water-balance precipitation replaces (the baseline's). */
  referencePrecipitationFactor: number | number[];
  /** A multi-decade run's scenario years and starting glacier; null for a season run. */
  transient: TransientMemberPlan | null;
}

/**
 * The engine input of one member: the stored catchment and forcing with the member's own changes
 * and the catchment's water side. With the water-balance precipitation the closure's factor
 * replaces the baseline's station factor; each member keeps its change relative to it.
 */
export function memberInput(inputs: RunInputs, memberIndex: number): MemberInput {
  const { input } = inputs.plans[memberIndex];
  const { water, waterBalancePrecipitation } = inputs.waterSide;
  const scenario = waterBalancePrecipitation
    ? { ...input.scenario, precipitationFactor: relativeFactor(input.scenario.precipitationFactor, inputs.referencePrecipitationFactor) } : input.scenario;
  const member = withWaterSide({ ...inputs.stored, ...input, scenario, start: inputs.start, water }, waterBalancePrecipitation);
  return inputs.transient ? { ...member, transient: inputs.transient } : member;
}

/** A season run's inputs without a water side (no gradients, closure, redistribution or routing): the station record as it is. */
export function seasonRunInputs(stored: CatchmentInputs, start: RunStart, plans: MemberPlan[]): RunInputs {
  return { stored, start, plans, waterSide: { water: NO_WATER_SIDE, waterBalancePrecipitation: false }, referencePrecipitationFactor: 1, transient: null };
}

/** Stores a run's inputs (inside the transaction that inserts the run). */
export async function saveRunInputs(scope: TenantScope, runId: number, inputs: RunInputs): Promise<void> {
  await scope.insert('run_inputs', { run_id: runId, inputs_gz: gzipSync(serialize(inputs), { level: 1 }) });
}

/** A run's inputs as stored by `saveRunInputs`; null when the run is gone. */
export async function loadRunInputs(db: Knex, runId: number, organisationId: number): Promise<RunInputs | null> {
  const row = await db('run_inputs').where({ run_id: runId, organisation_id: organisationId }).first('inputs_gz');
  return row ? (deserialize(gunzipSync(row.inputs_gz as Buffer)) as RunInputs) : null;
}
