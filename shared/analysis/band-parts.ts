import type { Scenario } from '../melt/schema';
import { IMPURITY_FIELDS, type ScenarioChanges } from '../schemas/scenarios';
import { engineInputOf } from './engine-input';

/** Bands simulated together because they share one engine scenario (indices into the catchment's bands). */
export interface BandPart {
  bandIndices: number[];
  scenario: Scenario;
}

/**
 * The engine scenario of one band: the scenario-wide impurity loads, replaced field by field by
 * the first elevation range that holds the band's mean elevation.
 */
export function scenarioForBand(changes: ScenarioChanges, meanElevationM: number): Scenario {
  const scenario = engineInputOf(changes).scenario;
  const range = changes.impuritiesByElevation.find((r) => meanElevationM >= r.fromM && meanElevationM < r.toM);
  if (!range) return scenario;
  const out: Scenario = { ...scenario };
  for (const field of IMPURITY_FIELDS) if (range[field] !== undefined) out[field] = range[field];
  return out;
}

/**
 * Groups bands that share a scenario; the engine then gives each band its group's impurity loads
 * in one simulation (simulate-summary.ts). Returns null when every band has the same scenario.
 */
export function groupBands(perBand: readonly Scenario[]): BandPart[] | null {
  const groups = new Map<string, BandPart>();
  perBand.forEach((scenario, b) => {
    const key = JSON.stringify(scenario);
    const group = groups.get(key);
    if (group) group.bandIndices.push(b);
    else groups.set(key, { bandIndices: [b], scenario });
  });
  return groups.size > 1 ? [...groups.values()] : null;
}
