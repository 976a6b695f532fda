import type { SimulationInput } from '../../../shared/melt/schema';
import type { ForcingSpan } from '../catchments/simulation-inputs';
import type { TenantScope } from '../tenant-scope';

/** The stored-data part of an engine input: the catchment with its bands and the climate forcing. */
export interface CatchmentInputs {
  catchment: SimulationInput['catchment'];
  forcing: SimulationInput['forcing'];
}

/**
 * Assembles a catchment's engine inputs from stored data for a period, the forcing reaching back
 * `spinUpYears` before it for the engine's spin-up (as far as the record allows).
 * Throws a 4xx AppError naming a missing dataset or a gap too long to bridge.
 */
export type CatchmentInputSource = (
  scope: TenantScope, catchmentId: number, period: { from: string; to: string } | null, span: ForcingSpan,
) => Promise<CatchmentInputs>;
