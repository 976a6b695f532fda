import type { Knex } from 'knex';
import type { AppConfig } from '../../config';
import type { BandService } from '../catchments/band-service';
import { ScenarioService } from './scenario-service';
import type { CatchmentInputSource } from './catchment-inputs';
import { storedCatchmentInputs } from './stored-catchment-inputs';
import { ResultsService } from './results-service';
import { RunExecutor } from './run-executor';
import { RunService } from './run-service';
import { SimulationPool } from './simulation-pool';

/** Scenarios, runs and results: the part of the context they need. */
export interface RunServices {
  scenarios: ScenarioService;
  runs: RunService;
  results: ResultsService;
  runExecutor: RunExecutor;
  simulationPool: SimulationPool;
}

export interface RunServicesOptions {
  /** Where engine inputs come from; stored catchment data unless a test gives its own. */
  catchmentInputs?: CatchmentInputSource;
}

export function createRunServices(config: AppConfig, db: Knex, bands: BandService, options: RunServicesOptions = {}): RunServices {
  const simulationPool = new SimulationPool(config.runs.workerThreads);
  const runExecutor = new RunExecutor(db, simulationPool, config.runs.concurrency);
  const scenarios = new ScenarioService();
  const runs = new RunService(scenarios, options.catchmentInputs ?? storedCatchmentInputs(bands), runExecutor);
  return { scenarios, runs, results: new ResultsService(runs), runExecutor, simulationPool };
}
