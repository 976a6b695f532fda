import type { Knex } from 'knex';
import type { AppConfig } from '../../config';
import type { BandService } from '../catchments/band-service';
import type { CalibrationStore } from '../lab/calibration-store';
import type { ThreadBudget } from '../thread-budget';
import type { WaterServices } from '../water';
import type { CatchmentInputSource } from './catchment-inputs';
import { ResultsService } from './results-service';
import { RunExecutor } from './run-executor';
import { RunService } from './run-service';
import { ScenarioService } from './scenario-service';
import { SimulationPool } from './simulation-pool';
import type { Simulator } from './simulator';
import { storedCatchmentInputs } from './stored-catchment-inputs';

export interface RunServices {
  scenarios: ScenarioService;
  runs: RunService;
  results: ResultsService;
  runExecutor: RunExecutor;
  /** The worker threads runs simulate on (idle when another simulator is given). */
  simulationPool: SimulationPool;
}

export interface RunServicesDeps {
  config: AppConfig;
  db: Knex;
  bands: BandService;
  calibrations: CalibrationStore;
  threads: ThreadBudget;
  /** The catchment's water side (gradients, closure, redistribution, routing, glacier). */
  water: WaterServices;
  /** Simulates run members; the worker pool unless given. */
  simulator?: Simulator;
  /** Where engine inputs come from; the catchment's stored data unless given. */
  catchmentInputs?: CatchmentInputSource;
}

/** Scenarios, runs (queued and simulated) and their results. */
export function createRunServices(deps: RunServicesDeps): RunServices {
  const simulationPool = new SimulationPool(deps.threads);
  const runExecutor = new RunExecutor(deps.db, deps.simulator ?? simulationPool, deps.config.runs.concurrency);
  const scenarios = new ScenarioService(deps.calibrations, deps.water.closures);
  const runs = new RunService(scenarios, deps.catchmentInputs ?? storedCatchmentInputs(deps.bands), deps.water.waterInputs, runExecutor);
  return { scenarios, runs, results: new ResultsService(runs, deps.calibrations), runExecutor, simulationPool };
}
