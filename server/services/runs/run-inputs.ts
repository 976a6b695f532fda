import { deserialize, serialize } from 'node:v8';
import { gunzipSync, gzipSync } from 'node:zlib';
import type { Knex } from 'knex';
import type { MemberPlan } from '../../../shared/analysis/run-plan';
import type { MemberInput } from '../../../shared/analysis/simulate-summary';
import type { RunStart } from '../../../shared/schemas/runs';
import type { TenantScope } from '../tenant-scope';
import type { CatchmentInputs } from './catchment-inputs';

/** Everything a run's members are simulated from: the stored part once, each member's plan beside it. */
export interface RunInputs {
  stored: CatchmentInputs;
  start: RunStart;
  plans: MemberPlan[];
}

/** The engine input of one member: the stored catchment and forcing with the member's own changes. */
export function memberInput(inputs: RunInputs, memberIndex: number): MemberInput {
  return { ...inputs.stored, ...inputs.plans[memberIndex].input, start: inputs.start };
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
