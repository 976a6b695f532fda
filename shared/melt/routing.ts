import { DEFAULT_ROUTING_PARAMETERS, emptyRoutingState, routeRunoff } from '../hydrology/runoff-routing';
import { SOURCES, type SimulationResult, type Source } from './result';
import type { EngineState } from './state-schema';
import type { ParsedInput } from './schema';

/**
 * Routes the run's daily runoff by source to the outlet (shared/hydrology/runoff-routing.ts,
 * linear reservoirs after Hock & Noetzli 1997) from the first simulated day — the spin-up's, so
 * the stores are filled when the period begins — or from the stores a given start state holds.
 * Writes the period's part into `result.catchmentDaily.routed` and returns the stores at the end.
 *
 * @param stepVolumesM3 runoff by source for every simulated day in order; the period's days are the last ones
 */
export function routeResult(input: ParsedInput, stepVolumesM3: Record<Source, Float64Array>, result: SimulationResult): NonNullable<EngineState['routing']> {
  const params = { ...DEFAULT_ROUTING_PARAMETERS, ...input.routing?.parameters };
  const start = input.start.method === 'state' && input.start.state.routing ? input.start.state.routing : emptyRoutingState();
  const routed = routeRunoff(stepVolumesM3, params, start);
  const skip = stepVolumesM3.snow.length - result.dayCount;
  const keys = [...SOURCES, 'total'] as const;
  const part = (series: Record<Source | 'total', Float64Array>) =>
    Object.fromEntries(keys.map((k) => [k, series[k].slice(skip)])) as Record<Source | 'total', Float64Array>;
  result.catchmentDaily.routed = { volumeM3: part(routed.volumeM3), dischargeM3s: part(routed.dischargeM3s) };
  return routed.endState;
}
