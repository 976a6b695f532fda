import type { SimulationInput } from '../../../shared/melt/schema';
import type { TenantScope } from '../tenant-scope';

/** The stored-data part of an engine input: the catchment with its bands and the climate forcing. */
export interface CatchmentInputs {
  catchment: SimulationInput['catchment'];
  forcing: SimulationInput['forcing'];
}

/**
 * Assembles a catchment's engine inputs from stored data for a period (null: the whole record).
 * Throws a 4xx AppError naming a missing dataset or a gap too long to bridge.
 */
export type CatchmentInputSource = (scope: TenantScope, catchmentId: number, period: { from: string; to: string } | null) => Promise<CatchmentInputs>;
