import type { ParameterOverrides, ScenarioChanges } from '../schemas/scenarios';

export interface SimulationSettings {
  period: { from: string; to: string } | null;
  parameters: ParameterOverrides;
  /** Whether the runs use the catchment's water-balance precipitation instead of the station record's. */
  waterBalancePrecipitation: boolean;
}

/**
 * The period, model parameters and precipitation source a scenario is simulated with: its own
 * where it sets them, else its baseline's, so a variant and the baseline it is compared with always run alike and the
 * added melt reflects only the variant's changes. `baseline` is null for the baseline itself.
 */
export function simulationSettings(
  changes: Partial<Pick<ScenarioChanges, 'period' | 'parameters' | 'precipitationSource'>>,
  baseline: Partial<Pick<ScenarioChanges, 'period' | 'parameters' | 'precipitationSource'>> | null,
): SimulationSettings {
  return {
    period: changes.period ?? baseline?.period ?? null,
    parameters: { ...baseline?.parameters, ...changes.parameters },
    waterBalancePrecipitation: (changes.precipitationSource ?? baseline?.precipitationSource ?? 'station') === 'water-balance',
  };
}
