import type { ParameterOverrides, ScenarioChanges } from '../schemas/scenarios';

export interface SimulationSettings {
  period: { from: string; to: string } | null;
  parameters: ParameterOverrides;
}

/**
 * The period and model parameters a scenario is simulated with: its own where it sets them, else
 * its baseline's, so a variant and the baseline it is compared with always run alike and the
 * added melt reflects only the variant's changes. `baseline` is null for the baseline itself.
 */
export function simulationSettings(
  changes: Partial<Pick<ScenarioChanges, 'period' | 'parameters'>>,
  baseline: Partial<Pick<ScenarioChanges, 'period' | 'parameters'>> | null,
): SimulationSettings {
  return {
    period: changes.period ?? baseline?.period ?? null,
    parameters: { ...baseline?.parameters, ...changes.parameters },
  };
}
