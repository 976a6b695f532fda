import type { Knex } from 'knex';
import type { JobQueues } from '../../queue/job-queues';
import type { BandService } from '../catchments/band-service';
import { CalibrationStore } from './calibration-store';
import { LabQueue } from './lab-queue';
import { LabService } from './lab-service';

export interface LabServices {
  lab: LabService;
}

/** The lab: its computations on the lab queue (run by the worker processes), its jobs and the saved calibrations. */
export function createLabServices(deps: { db: Knex; bands: BandService; queues: JobQueues; workerThreads: number }): LabServices {
  return { lab: new LabService(deps.db, deps.bands, new LabQueue(deps.queues, deps.workerThreads), new CalibrationStore()) };
}
