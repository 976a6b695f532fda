/**
 * The Tarnish melt engine: hourly energy balance per elevation band. Pure TypeScript, no I/O —
 * the same code runs in the browser, on the server and in worker threads. See README.md.
 */
export { ENGINE_VERSION } from './version';
export { simulate, simulateDegreeDay, simulateEnhancedTemperatureIndex, type SimulateOptions } from './simulate';
export type { Progress, ProgressCallback } from './engine-loop';
export {
  simulationInputSchema, catchmentSchema, bandSchema, forcingSchema, parametersSchema, scenarioSchema,
  type SimulationInput, type ParsedInput, type Band, type Scenario, type Forcing,
} from './schema';
export { parseSimulationInput, SimulationInputError } from './prepare';
export { DEFAULT_PARAMETERS, PARAMETER_RANGES, PARAMETER_NAMES, type Parameters, type ParameterName } from './parameters';
export {
  BAND_DAY_FIELDS, BAND_TOTAL_FIELDS, SOURCES,
  type SimulationResult, type BandDayField, type BandTotalField, type Source, type MeltModel, type BandInfo,
} from './result';
export { compareRuns } from './compare';
export { summariseByMonth, type BandMonthSummary } from './monthly';
export { resultToJson } from './result-json';
export { fillShortGaps } from './fill-gaps';
export { solarPosition, type SolarPosition } from './solar-position';
export { cosIncidence } from './incidence';
export { extraterrestrialDaily, clearSkyDaily } from './fao56';
export { pressureAt } from './pressure';
export { snowAlbedo, type SnowAlbedoInput } from './snow-albedo';
export { iceAlbedo, type IceAlbedoRule } from './ice-albedo';
export { incomingLongwave } from './longwave';
export { debrisSurfaceTemperature } from './debris';
export { meltMmPerDay } from './energy';
export { nse, kge } from './skill';
export { bandWaterBalance, type BandWaterBalance } from './water-balance';
export { planDays, hydrologicalYearStartBefore, type StartReport } from './spin-up';
export { startSchema, SHORTWAVE_SOURCES, type ShortwaveSource, type Start } from './schema';
export { engineStateSchema, STATE_FIELDS, type EngineState } from './state-schema';
export { plainSource, RETIRED_PARAMETER_NAMES } from './parameters';
export { thinSnowAlbedo, cloudAlbedoChange } from './snow-albedo';
export { erbsDiffuseFraction } from './diffuse-split';
export { beamIndex, diffuseIndex, precipitableWaterMm } from './clear-sky';
export { temperatureRangeClearSkyIndex } from './temperature-range';
export { stabilityFactor, neutralExchange } from './turbulence';
export { depletion as snowCoverDepletion } from './snow-cover';
export { sunlitShare, horizonSector } from './terrain';
