import { prepareRun, type PreparedRun } from './prepare';
import { buildSunTrack } from './sun-track';
import { buildShortwaveForcing } from './shortwave-forcing';
import { buildLoopContext } from './loop-context';
import { runSegments, type ProgressCallback } from './engine-loop';
import { allocateResult, summarise, type MeltModel, type SimulationResult } from './result';
import { stateToJson } from './state';
import { routeResult } from './routing';
import { ENGINE_VERSION } from './version';

export interface SimulateOptions {
  /** Called after each simulated calendar month (spin-up included) and at the end. */
  onProgress?: ProgressCallback;
}

function bandInfo(run: PreparedRun) {
  const g = run.geometry;
  return {
    elevationM: g.elevationM,
    areaM2: g.areaM2,
    cleanIceAreaM2: g.areaM2.map((a, b) => a * g.cleanIceShare[b]),
    debrisAreaM2: g.areaM2.map((a, b) => a * g.debrisShare[b]),
    debrisThicknessM: g.debrisThicknessM,
  };
}

function runModel(raw: unknown, model: MeltModel, options: SimulateOptions): SimulationResult {
  const run = prepareRun(raw);
  const { catchment } = run.input;
  const sun = buildSunTrack(run.timeline, catchment.latitudeDeg, catchment.longitudeDeg);
  const shortwave = buildShortwaveForcing(run.timeline, sun, run.forcing, run.params, run.stationPressurePa, run.input.shortwaveSource);
  const result = allocateResult(model, ENGINE_VERSION, run.recordStartDate, run.recordDays, bandInfo(run), { start: run.startReport, shortwaveSource: shortwave.source });
  const context = buildLoopContext(run, sun, shortwave, model);
  const sweStart = runSegments(context, result, options.onProgress);
  summarise(result, sweStart);
  result.endState = stateToJson(run.state);
  if (context.stepVolumesM3) result.endState.routing = routeResult(run.input, context.stepVolumesM3, result);
  return result;
}

/**
 * Simulates every band hour by hour with the energy balance (see README.md), after a spin-up
 * unless the input gives a start state. Throws SimulationInputError naming each invalid field;
 * the result never contains NaN.
 *
 * @param input a simulation input (see simulationInputSchema); validated here
 */
export function simulate(input: unknown, options: SimulateOptions = {}): SimulationResult {
  return runModel(input, 'energy-balance', options);
}

/**
 * Reference model: hourly degree-day melt, M = DDF/24 · max(T, 0) per hour, with snow and ice
 * factors (Hock 2003) and the hyperbolic debris reduction H* / (H* + h) (Anderson & Anderson 2016).
 * Same inputs, snowpack (cover, retention) and outputs as simulate, without refreezing or vapour
 * exchange; energy fluxes in the result are 0 apart from shortwave.
 */
export function simulateDegreeDay(input: unknown, options: SimulateOptions = {}): SimulationResult {
  return runModel(input, 'degree-day', options);
}

/**
 * Reference model: enhanced temperature-index melt (Pellicciotti et al. 2005),
 * M = TF·T + SRF·(1 − α)·G per hour when T > TT, with the engine's albedo and slope shortwave G;
 * debris-covered ice uses the clean-ice value times H* / (H* + h). Energy fluxes are 0 apart from shortwave.
 */
export function simulateEnhancedTemperatureIndex(input: unknown, options: SimulateOptions = {}): SimulationResult {
  return runModel(input, 'enhanced-temperature-index', options);
}
