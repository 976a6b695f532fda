import type { Scenario } from '../melt/schema';
import type { ParameterOverrides, ScenarioChanges } from '../schemas/scenarios';
import { groupBands, scenarioForBand, type BandPart } from './band-parts';
import { changedDrivers, combinedScenario, DRIVER_NAMES, type Driver } from './drivers';
import { engineInputOf, type ScenarioEngineInput } from './engine-input';
import { ensembleParameterSets } from './ensemble-parameters';
import { simulationSettings } from './variant-settings';

export const MEMBER_KINDS = ['scenario', 'baseline', 'combination', 'ensemble-scenario', 'ensemble-baseline'] as const;
export type MemberKind = (typeof MEMBER_KINDS)[number];

/** One simulation of a run. */
export interface MemberPlan {
  key: string;
  kind: MemberKind;
  /** Factor-separation combination: bit i set = drivers[i] taken from the variant. */
  combinationMask: number | null;
  ensembleIndex: number | null;
  /** Band groups with their own scenarios when impurities differ by elevation; null otherwise. */
  input: ScenarioEngineInput & { parts: BandPart[] | null };
}

export interface RunRequest {
  changes: ScenarioChanges;
  /** The catchment baseline's changes; null when the scenario run is the baseline itself. */
  baselineChanges: ScenarioChanges | null;
  attribution: boolean;
  ensembleSize: number;
  ensembleSeed: number;
}

export interface RunPlan {
  members: MemberPlan[];
  /** Drivers separated by attribution, in mask-bit order (empty without attribution). */
  drivers: Driver[];
}

export class RunPlanError extends Error {}

/** Drivers a variant changes relative to its baseline anywhere: catchment-wide or in any band's elevation range. */
export function attributionDrivers(changes: ScenarioChanges, baselineChanges: ScenarioChanges, bandElevationsM: readonly number[]): Driver[] {
  const pairs: [Scenario, Scenario][] = [
    [engineInputOf(baselineChanges).scenario, engineInputOf(changes).scenario],
    ...bandElevationsM.map((m): [Scenario, Scenario] => [scenarioForBand(baselineChanges, m), scenarioForBand(changes, m)]),
  ];
  const changed = new Set(pairs.flatMap(([b, v]) => changedDrivers(b, v)));
  return DRIVER_NAMES.filter((d) => changed.has(d));
}

/**
 * The simulations a run needs. A variant is always paired with its baseline simulated on the
 * same period and parameters (see `simulationSettings`), so added melt reflects only the changes; attribution adds the
 * 2^N − 2 mixed combinations of its N changed drivers (Stein & Alpert 1993); an ensemble adds, per
 * Latin hypercube parameter set, the scenario and (for a variant) the baseline.
 */
export function planRun(request: RunRequest, bandElevationsM: readonly number[]): RunPlan {
  const { changes, baselineChanges, attribution, ensembleSize, ensembleSeed } = request;
  const { period, parameters, physics } = simulationSettings(changes, baselineChanges);
  const variant = engineInputOf({ ...changes, period }, parameters, physics);
  const variantBands = bandElevationsM.map((m) => scenarioForBand(changes, m));
  const baselineBands = baselineChanges ? bandElevationsM.map((m) => scenarioForBand(baselineChanges, m)) : null;
  const member = (perBand: Scenario[], scenario: Scenario, parameters: ParameterOverrides) =>
    ({ ...variant, scenario, parameters, parts: groupBands(perBand) });

  const members: MemberPlan[] = [
    { key: 'scenario', kind: 'scenario', combinationMask: null, ensembleIndex: null, input: member(variantBands, variant.scenario, variant.parameters) },
  ];
  const baselineOn = (parameters: ParameterOverrides) =>
    baselineChanges && baselineBands ? member(baselineBands, engineInputOf(baselineChanges).scenario, parameters) : null;
  const baseline = baselineOn(variant.parameters);
  if (baseline) members.push({ key: 'baseline', kind: 'baseline', combinationMask: null, ensembleIndex: null, input: baseline });

  let drivers: Driver[] = [];
  if (attribution) {
    if (!baseline || !baselineBands) throw new RunPlanError('Attribution splits a variant\'s added melt; the baseline has nothing to split.');
    drivers = attributionDrivers(changes, baselineChanges!, bandElevationsM);
    if (drivers.length === 0) throw new RunPlanError('This variant changes nothing relative to the baseline, so there is nothing to attribute.');
    const full = (1 << drivers.length) - 1;
    for (let mask = 1; mask < full; mask++) {
      const perBand = baselineBands.map((b, i) => combinedScenario(b, variantBands[i], drivers, mask));
      members.push({
        key: `combination:${mask}`, kind: 'combination', combinationMask: mask, ensembleIndex: null,
        input: member(perBand, combinedScenario(baseline.scenario, variant.scenario, drivers, mask), variant.parameters),
      });
    }
  }

  if (ensembleSize > 0) {
    ensembleParameterSets(ensembleSize, ensembleSeed, variant.parameters).forEach((parameters, i) => {
      members.push({ key: `ensemble:${i}:scenario`, kind: 'ensemble-scenario', combinationMask: null, ensembleIndex: i, input: member(variantBands, variant.scenario, parameters) });
      const paired = baselineOn(parameters);
      if (paired) members.push({ key: `ensemble:${i}:baseline`, kind: 'ensemble-baseline', combinationMask: null, ensembleIndex: i, input: paired });
    });
  }
  return { members, drivers };
}
