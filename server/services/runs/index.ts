import type { Knex } from 'knex';
import type { JobQueues } from '../../queue/job-queues';
import type { BandService } from '../catchments/band-service';
import type { CalibrationStore } from '../lab/calibration-store';
import type { WaterServices } from '../water';
import type { CatchmentInputSource } from './catchment-inputs';
import { ResultsService } from './results-service';
import { RunQueue } from './run-queue';
import { RunService } from './run-service';
import { ScenarioService } from './scenario-service';
import { storedCatchmentInputs } from './stored-catchment-inputs';

export interface RunServices {
  scenarios: ScenarioService;
  runs: RunService;
  results: ResultsService;
  /** Run members as jobs on the simulations queue (the worker processes simulate them). */
  runQueue: RunQueue;
}

export interface RunServicesDeps {
  db: Knex;
  bands: BandService;
  calibrations: CalibrationStore;
  queues: JobQueues;
  /** The catchment's water side (gradients, closure, redistribution, routing, glacier). */
  water: WaterServices;
  /** Where engine inputs come from; the catchment's stored data unless given. */
  catchmentInputs?: CatchmentInputSource;
}

/** Scenarios, runs (queued for the worker processes) and their results. */
export function createRunServices(deps: RunServicesDeps): RunServices {
  const runQueue = new RunQueue(deps.db, deps.queues);
  const scenarios = new ScenarioService(deps.calibrations, deps.water.closures);
  const runs = new RunService(scenarios, deps.catchmentInputs ?? storedCatchmentInputs(deps.bands), deps.water.waterInputs, runQueue);
  return { scenarios, runs, results: new ResultsService(runs, deps.calibrations), runQueue };
}
