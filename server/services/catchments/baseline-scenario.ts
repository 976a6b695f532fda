import { BASELINE_NAME, SCENARIO_SCHEMA_VERSION, scenarioChangesSchema } from '../../../shared/schemas/scenarios';
import type { TenantScope } from '../tenant-scope';

/**
 * Inserts a catchment's baseline: the station record without changes, flagged `is_baseline`
 * (one per catchment, enforced by the database). Call it in the transaction that creates the
 * catchment, so no catchment is ever without one.
 */
export async function insertBaseline(scope: TenantScope, catchmentId: number, createdBy: number | null): Promise<number> {
  return scope.insert('scenarios', {
    catchment_id: catchmentId, name: BASELINE_NAME, description: 'The station record without changes.', is_baseline: true,
    schema_version: SCENARIO_SCHEMA_VERSION, changes: JSON.stringify(scenarioChangesSchema.parse({})), created_by: createdBy,
  });
}
