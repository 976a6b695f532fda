import { simulate } from '../melt/simulate';
import type { BandImpurities, SimulationInput } from '../melt/schema';
import { IMPURITY_FIELDS } from '../schemas/scenarios';
import type { BandPart } from './band-parts';
import { summariseSimulation, type SimulationSummary } from './simulation-summary';
import { simulateTransient, type TransientMemberPlan, type TransientSummary } from './transient-member';

/** An engine input, optionally with band groups that each have their own impurity loads, and the years of a multi-decade run. */
export type MemberInput = SimulationInput & { parts?: BandPart[] | null; transient?: TransientMemberPlan | null };

/** What one run member gives back: a season's summary or a multi-decade run's years. */
export type MemberSummary = SimulationSummary | TransientSummary;

export const isTransientSummary = (s: MemberSummary): s is TransientSummary => 'kind' in s && s.kind === 'transient';

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

function engineInputOf(input: MemberInput): SimulationInput {
  const { parts, transient: _transient, ...engineInput } = input;
  return parts ? { ...engineInput, impuritiesByBand: impuritiesOfParts(parts, engineInput.catchment.bands.length) } : engineInput;
}

/** Simulates one season member and returns what a run stores. */
export function simulateSummary(input: MemberInput, onProgress?: (fraction: number) => void): SimulationSummary {
  return summariseSimulation(simulate(engineInputOf(input), { onProgress: (p) => onProgress?.(p.fraction) }));
}

/** Simulates one run member, a season or a multi-decade run. */
export function simulateMember(input: MemberInput, onProgress?: (fraction: number) => void): MemberSummary {
  return input.transient ? simulateTransient({ ...engineInputOf(input), transient: input.transient }, onProgress) : simulateSummary(input, onProgress);
}
