import { PARAMETER_SPECS, type ParameterName } from '../melt/parameters';
import type { ParameterOverrides } from '../schemas/scenarios';
import { latinHypercube } from './latin-hypercube';
import { seededRandom } from './random';

/**
 * Parameters an ensemble varies: those that dominate the uncertainty of added melt — grain growth,
 * the impurity albedo effect and its enrichment in melting snow, lapse rate, radiation from the temperature range, debris conductivity (docs/science.md,
 * "Uncertainty").
 */
export const ENSEMBLE_PARAMETERS = [
  'wetGrainGrowthMm3PerDay', 'dustToBlackCarbon', 'iceAlbedoBlackCarbonSlope', 'iceAlbedoDustSlope',
  'lapseRateCPerKm', 'temperatureRangeRadiationCoefficient', 'debrisConductivity', 'scavengingBlackCarbon',
] as const satisfies readonly ParameterName[];

export const DEFAULT_ENSEMBLE_SIZE = 50;
export const MAX_ENSEMBLE_SIZE = 200;

/**
 * `size` parameter sets by Latin hypercube sampling, uniform over each parameter's published range
 * (PARAMETER_SPECS); the scenario's other overrides are kept. Same seed, same sets.
 */
export function ensembleParameterSets(size: number, seed: number, base: ParameterOverrides): ParameterOverrides[] {
  const points = latinHypercube(size, ENSEMBLE_PARAMETERS.length, seededRandom(seed));
  return points.map((u) => {
    const set: ParameterOverrides = { ...base };
    ENSEMBLE_PARAMETERS.forEach((name, j) => {
      const { min, max } = PARAMETER_SPECS[name];
      set[name] = min + u[j] * (max - min);
    });
    return set;
  });
}
