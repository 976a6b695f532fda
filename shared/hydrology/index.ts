/**
 * Where the water comes from: the catchment's water side, as pure libraries beside the melt engine
 * (no I/O, no DOM, no Node APIs). See README.md for the equations, ranges, sources and the hooks
 * the engine calls.
 */
export { HydrologyInputError, type HydrologyIssue } from './errors';
export { checkStations, catchmentRange, bandMidM, MONTHS, MONTH_NAMES, type ElevationBand, type StationClimate } from './stations';
export { fitLine, type LineFit } from './line-fit';
export { fitMonthlyLapseRates, type MonthlyLapseRate } from './lapse-rate';
export { precipitationMultiplier, checkProfile, PROFILE_PARAMETERS, type PrecipitationProfile } from './precipitation-profile';
export { fitLinearProfile, fitPeakedProfile, fittedPrecipitationMm, type ProfileFit, type ProfilePoint, type PeakedFitOptions, type ProfileParameter } from './precipitation-fit';
export { glacierAirTemperatureC, checkGlacierDamping, GLACIER_DAMPING_PARAMETERS, DRY_ADIABATIC_K_PER_M, type GlacierDampingParameters } from './glacier-air-temperature';
export { fitStationGradients, chooseMonthlyGradients, type StationGradients, type StationGradientsInput, type PrecipitationFitChoice, type MonthlyOverrides, type ChosenGradients, type GradientOrigin } from './station-gradients';
export { bandClimate, type BandClimate, type BandClimateInput, type ClimateBand } from './band-climate';
export {
  invertWaterBalance, WaterBalanceNotClosedError, PRECIPITATION_FACTOR,
  type InversionInput, type InversionResult, type BalanceCandidate, type BalanceEvaluator, type ModelledBalance,
  type BalanceObservations, type BalanceTerms, type BalanceUnknown, type Measured,
} from './water-balance';
export { avalanche, planAvalanching, holdingCapacityMm, AVALANCHE_PARAMETERS, DEFAULT_AVALANCHE_PARAMETERS, type AvalanchePlan, type AvalancheParameters, type AvalancheBand } from './avalanche';
export { windDrift, planWindDrift, WIND_FACTOR, type WindDriftPlan } from './wind-drift';
export { reservoirCoefficients, type ReservoirCoefficients } from './linear-reservoir';
export {
  routeRunoff, emptyRoutingState, steadyRoutingState, storedVolumeM3, ROUTING_PARAMETERS, DEFAULT_ROUTING_PARAMETERS,
  type RoutingParameters, type RoutingState, type RoutedRunoff, type RunoffBySource,
} from './runoff-routing';
export { normalisedThinning, glacierSizeClass, DELTA_H_COEFFICIENTS, type GlacierSizeClass, type DeltaHCoefficients } from './delta-h';
export { initialGlacier, glacierVolumeKm3, glacierVolumeOf, VOLUME_AREA, type GlacierBand, type GlacierState, type InitialGlacierOptions } from './glacier-volume';
export { updateGlacier, type GlacierUpdate, type GlacierUpdateOptions } from './glacier-update';
export { warmingPath, REGIONAL_WARMING_FACTOR, type WarmingPath, type WarmingPathInput } from './warming-path';
export { recordYearSequence } from './record-years';
export { peakWater, comparePeakWater, movingMean, type PeakWater } from './peak-water';
export { runTransient, transientYears, type TransientYear, type TransientRow, type TransientResult, type YearOutcome, type YearSimulator } from './transient-run';
