import { bandClimate } from '../hydrology/band-climate';
import type { GlacierDampingParameters } from '../hydrology/glacier-air-temperature';
import type { PrecipitationProfile } from '../hydrology/precipitation-profile';
import { PARAMETER_SPECS } from '../melt/parameters';
import type { SimulationInput } from '../melt/schema';
import type { ParameterOverrides } from '../schemas/scenarios';
import type { GlacierSettings } from '../schemas/water-settings';

/**
 * The water side of a catchment's stored inputs, as the server assembles it from the catchment's
 * settings, stations and saved water-balance closure (and hashes it with the rest of a run's inputs).
 */
export interface WaterInputs {
  /** The monthly gradients chosen from the stations (fitted, assumed or set by hand); null: the engine's own lapse rate and gradient. */
  gradients: {
    lapseRatesKPerKm: number[];
    profiles: PrecipitationProfile[];
    damping: (GlacierDampingParameters & { referenceMonthlyTemperatureC: number[] }) | null;
  } | null;
  /** The newest saved water-balance closure: the factor and profile that close the balance; null when none is saved. */
  closure: { precipitationFactor: number; profile: PrecipitationProfile } | null;
  redistribution: NonNullable<SimulationInput['redistribution']> | null;
  routing: NonNullable<SimulationInput['routing']> | null;
  glacier: GlacierSettings;
}

export const NO_WATER_SIDE: WaterInputs = Object.freeze({
  gradients: null, closure: null, redistribution: null, routing: null,
  glacier: { method: 'volume-area', glacierAreasKm2: null, coefficientKm: 0.034, exponent: 1.375 },
}) as WaterInputs;

/** What the water side adds to one engine input. */
export interface EngineWaterSide {
  bandClimate?: SimulationInput['bandClimate'];
  redistribution?: SimulationInput['redistribution'];
  routing?: SimulationInput['routing'];
  /** Multiplies the scenario's precipitation factor: the closure's factor with the water-balance precipitation, else 1. */
  precipitationScale: number;
}

/**
 * The engine's water-side input for one simulation with the given parameters. Band temperature
 * comes from the chosen gradients, else from the parameters' lapse rate; band precipitation from
 * the water-balance profile when the scenario uses it, else the chosen gradients, else the
 * parameters' gradient. When neither gradients nor the closure apply, no band climate is sent and
 * the engine keeps its own behaviour, so stored inputs and ensembles over the lapse rate work as before.
 */
export function engineWaterSide(catchment: SimulationInput['catchment'], water: WaterInputs, parameters: ParameterOverrides, useClosure: boolean): EngineWaterSide {
  const closure = useClosure ? water.closure : null;
  const side: EngineWaterSide = {
    ...(water.redistribution ? { redistribution: water.redistribution } : {}),
    ...(water.routing ? { routing: water.routing } : {}),
    precipitationScale: closure ? closure.precipitationFactor : 1,
  };
  if (!water.gradients && !closure) return side;
  const lapse = parameters.lapseRateCPerKm ?? PARAMETER_SPECS.lapseRateCPerKm.default;
  const gradient = parameters.precipitationGradientPerKm ?? PARAMETER_SPECS.precipitationGradientPerKm.default;
  const climate = bandClimate({
    bands: catchment.bands,
    referenceElevationM: catchment.stationElevationM,
    lapseRatesKPerKm: water.gradients?.lapseRatesKPerKm ?? Array<number>(12).fill(lapse),
    profiles: closure ? Array<PrecipitationProfile>(12).fill(closure.profile) : water.gradients?.profiles ?? Array<PrecipitationProfile>(12).fill({ kind: 'linear', gradientPerKm: gradient }),
    ...(water.gradients?.damping ? { glacierDamping: water.gradients.damping } : {}),
  });
  side.bandClimate = {
    temperatureOffsetK: Array.from(climate.temperatureOffsetK),
    glacierTemperatureOffsetK: Array.from(climate.glacierTemperatureOffsetK),
    precipitationMultiplier: Array.from(climate.precipitationMultiplier),
  };
  return side;
}

/** A scenario precipitation factor (one or twelve monthly values) times a scale. */
export function scaledFactor(factor: number | number[], scale: number): number | number[] {
  if (scale === 1) return factor;
  return Array.isArray(factor) ? factor.map((f) => f * scale) : factor * scale;
}

/**
 * One simulation's engine input from the stored inputs (catchment, forcing and their water side)
 * and its own scenario and parameters: the water side applied, the stored part dropped.
 */
export function withWaterSide<T extends Pick<SimulationInput, 'catchment' | 'scenario' | 'parameters'> & { water?: WaterInputs }>(input: T, useClosure: boolean): Omit<T, 'water'> & Partial<Pick<SimulationInput, 'bandClimate' | 'redistribution' | 'routing'>> {
  const { water, ...rest } = input;
  const { precipitationScale, ...side } = engineWaterSide(input.catchment, water ?? NO_WATER_SIDE, input.parameters ?? {}, useClosure);
  const scenario: NonNullable<SimulationInput['scenario']> = rest.scenario ?? {};
  return { ...rest, ...side, scenario: { ...scenario, precipitationFactor: scaledFactor(scenario.precipitationFactor ?? 1, precipitationScale) } };
}
