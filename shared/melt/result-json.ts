import type { SimulationResult } from './result';

/** Plain-JSON copy of a result: typed arrays become number arrays. */
export function resultToJson(result: SimulationResult): unknown {
  return JSON.parse(JSON.stringify(result, (_key, value) => (value instanceof Float64Array ? Array.from(value) : value)));
}
