import { validationFailed } from '../../errors';
import type { BandService } from '../catchments/band-service';
import { buildSimulationInputs, requireReadyInputs } from '../catchments/simulation-inputs';
import type { CatchmentInputSource } from './catchment-inputs';

/** Engine inputs from the catchment's stored bands and climate datasets; refuses missing data and unbridgeable gaps by name. */
export function storedCatchmentInputs(bands: BandService): CatchmentInputSource {
  return async (scope, catchmentId, period, span) => {
    if (!period) throw validationFailed('Set the simulation period (in the scenario or the baseline) before running.', 'changes.period');
    const input = requireReadyInputs(await buildSimulationInputs(scope, bands, catchmentId, period, span));
    return { catchment: input.catchment, forcing: input.forcing };
  };
}
