import type { ParameterOverrides, ScenarioChanges } from '../schemas/scenarios';

export interface SimulationSettings {
  period: { from: string; to: string } | null;
  parameters: ParameterOverrides;
  physics: { stabilityCorrection: boolean };
  /** Whether the runs use the catchment's water-balance precipitation instead of the station record's. */
  waterBalancePrecipitation: boolean;
}

type Settable = Partial<Pick<ScenarioChanges, 'period' | 'parameters' | 'stabilityCorrection' | 'precipitationSource'>>;

/**
 * The period, model parameters, physics options and precipitation source a scenario is simulated
 * with: its own where it sets them, else its baseline's, so a variant and the baseline it is
 * compared with always run alike and the added melt reflects only the variant's changes.
 * `baseline` is null for the baseline itself.
 */
export function simulationSettings(changes: Settable, baseline: Settable | null): SimulationSettings {
  return {
    period: changes.period ?? baseline?.period ?? null,
    parameters: { ...baseline?.parameters, ...changes.parameters },
    physics: { stabilityCorrection: changes.stabilityCorrection ?? baseline?.stabilityCorrection ?? false },
    waterBalancePrecipitation: (changes.precipitationSource ?? baseline?.precipitationSource ?? 'station') === 'water-balance',
  };
}
