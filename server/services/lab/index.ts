import type { Knex } from 'knex';
import type { JobQueues } from '../../queue/job-queues';
import type { BandService } from '../catchments/band-service';
import type { WaterServices } from '../water';
import { CalibrationStore } from './calibration-store';
import { LabQueue } from './lab-queue';
import { LabService } from './lab-service';
import { WaterBalanceService } from './water-balance-service';

export interface LabServices {
  lab: LabService;
  waterBalance: WaterBalanceService;
}

/** The lab: its computations on the lab queue (run by the worker processes), its jobs, the saved calibrations and the water-balance closure. */
export function createLabServices(deps: { db: Knex; bands: BandService; queues: JobQueues; workerThreads: number; water: WaterServices }): LabServices {
  const lab = new LabService(deps.db, deps.queues, deps.bands, new LabQueue(deps.queues, deps.workerThreads), new CalibrationStore(), deps.water);
  return { lab, waterBalance: new WaterBalanceService(lab, deps.water) };
}
