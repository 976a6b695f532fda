import { bandClimate } from '../hydrology/band-climate';
import type { PrecipitationProfile } from '../hydrology/precipitation-profile';
import { PARAMETER_SPECS } from '../melt/parameters';
import type { SimulationInput } from '../melt/schema';
import type { ParameterOverrides } from '../schemas/scenarios';
import type { GlacierSettings } from '../schemas/water-settings';
import type { WaterInputs } from '../schemas/water-inputs';
import { initialGlacier, type GlacierBand, type GlacierState } from '../hydrology/glacier-volume';

export type { WaterInputs } from '../schemas/water-inputs';

/** What a run stores of its water side: the inputs and whether it took the water-balance precipitation. */
export interface RunWaterSide {
  water: WaterInputs;
  waterBalancePrecipitation: boolean;
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

/**
 * The glacier a multi-decade run starts from, by the catchment's glacier settings: a thickness per
 * band, or the volume–area relation over the given glaciers (one glacier of the bands' total by default).
 * @throws HydrologyInputError naming the setting that does not fit the bands
 */
export function initialGlacierOf(bands: readonly GlacierBand[], settings: GlacierSettings): GlacierState {
  return initialGlacier(bands, settings.method === 'thickness'
    ? { iceThicknessM: settings.iceThicknessM }
    : { glacierAreasKm2: settings.glacierAreasKm2 ?? undefined, coefficientKm: settings.coefficientKm, exponent: settings.exponent });
}

/** A scenario precipitation factor (one or twelve monthly values) times a scale. */
export function scaledFactor(factor: number | number[], scale: number): number | number[] {
  if (scale === 1) return factor;
  return Array.isArray(factor) ? factor.map((f) => f * scale) : factor * scale;
}

/**
 * A scenario's precipitation factor relative to its baseline's, month by month: with the
 * water-balance precipitation the closure's factor replaces the baseline's station factor, and a
 * variant keeps only its change relative to the baseline (e.g. +10 %).
 * @example relativeFactor(1.65, 1.5) // 1.1
 */
export function relativeFactor(factor: number | number[], reference: number | number[]): number | number[] {
  const at = (v: number | number[], m: number) => (Array.isArray(v) ? v[m] : v);
  if (!Array.isArray(factor) && !Array.isArray(reference)) return reference > 0 ? factor / reference : factor;
  return Array.from({ length: 12 }, (_, m) => (at(reference, m) > 0 ? at(factor, m) / at(reference, m) : at(factor, m)));
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

/**
 * The water side of one band simulated alone (the scenario builder's preview): its twelve months
 * of the catchment's band climate; one band exchanges no snow and is not routed.
 */
export function bandWaterSide(catchment: SimulationInput['catchment'], water: WaterInputs, parameters: ParameterOverrides, band: number, useClosure: boolean): Pick<EngineWaterSide, 'bandClimate' | 'precipitationScale'> {
  const { bandClimate: all, precipitationScale } = engineWaterSide(catchment, { ...water, redistribution: null, routing: null }, parameters, useClosure);
  if (!all) return { precipitationScale };
  const months = (values: number[]) => values.slice(band * 12, band * 12 + 12);
  return {
    precipitationScale,
    bandClimate: { temperatureOffsetK: months(all.temperatureOffsetK), glacierTemperatureOffsetK: months(all.glacierTemperatureOffsetK), precipitationMultiplier: months(all.precipitationMultiplier) },
  };
}
