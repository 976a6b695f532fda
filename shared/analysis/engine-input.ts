import type { Scenario } from '../melt/schema';
import type { ParameterOverrides, ScenarioChanges } from '../schemas/scenarios';

/** The part of an engine input a scenario decides; the catchment and forcing come from stored data. */
export interface ScenarioEngineInput {
  scenario: Scenario;
  parameters: ParameterOverrides;
  period?: { from: string; to: string };
  physics?: { stabilityCorrection: boolean };
}

/** Maps stored scenario changes onto the engine's scenario, parameters, period and physics options. */
export function engineInputOf(
  changes: ScenarioChanges, parameters: ParameterOverrides = changes.parameters,
  physics: ScenarioEngineInput['physics'] = { stabilityCorrection: changes.stabilityCorrection ?? false },
): ScenarioEngineInput {
  return {
    scenario: {
      temperatureDeltaC: changes.temperatureDeltaC,
      precipitationFactor: changes.precipitationFactor,
      blackCarbonSnowNgG: changes.blackCarbonSnowNgG,
      blackCarbonIceNgG: changes.blackCarbonIceNgG,
      dustSnowUgG: changes.dustSnowUgG,
      dustIceUgG: changes.dustIceUgG,
      blackCarbonDepositionUgM2Day: changes.blackCarbonDepositionUgM2Day,
      dustDepositionMgM2Day: changes.dustDepositionMgM2Day,
      debrisThicknessChangeM: changes.debrisThicknessChangeM,
      debrisExtentChange: changes.debrisExtentChange,
    },
    parameters,
    physics,
    ...(changes.period ? { period: changes.period } : {}),
  };
}
