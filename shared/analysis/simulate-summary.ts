import { simulate } from '../melt/simulate';
import type { BandImpurities, SimulationInput } from '../melt/schema';
import { IMPURITY_FIELDS } from '../schemas/scenarios';
import type { BandPart } from './band-parts';
import { summariseSimulation, type SimulationSummary } from './simulation-summary';

/** An engine input, optionally with band groups that each have their own impurity loads. */
export type MemberInput = SimulationInput & { parts?: BandPart[] | null };

/**
 * The engine's per-band loads from band groups: each band takes its group's impurity fields.
 * All bands run in one simulation, so snow moved between bands keeps every band's own loads.
 */
export function impuritiesOfParts(parts: readonly BandPart[], bandCount: number): (BandImpurities | null)[] {
  const out = new Array<BandImpurities | null>(bandCount).fill(null);
  for (const part of parts) {
    const loads = Object.fromEntries(IMPURITY_FIELDS.map((f) => [f, part.scenario[f]])) as BandImpurities;
    for (const b of part.bandIndices) out[b] = loads;
  }
  return out;
}

/** Simulates one run member and returns what a run stores. */
export function simulateSummary(input: MemberInput, onProgress?: (fraction: number) => void): SimulationSummary {
  const { parts, ...engineInput } = input;
  const withLoads = parts ? { ...engineInput, impuritiesByBand: impuritiesOfParts(parts, engineInput.catchment.bands.length) } : engineInput;
  return summariseSimulation(simulate(withLoads, { onProgress: (p) => onProgress?.(p.fraction) }));
}
