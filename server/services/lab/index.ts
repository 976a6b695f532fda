import type { Knex } from 'knex';
import type { BandService } from '../catchments/band-service';
import type { ThreadBudget } from '../thread-budget';
import type { WaterServices } from '../water';
import { CalibrationStore } from './calibration-store';
import { LabPool } from './lab-pool';
import { LabService } from './lab-service';
import { WaterBalanceService } from './water-balance-service';

export interface LabServices {
  lab: LabService;
  waterBalance: WaterBalanceService;
}

/** The lab: its worker pool on the shared thread budget, its jobs and the saved calibrations. */
export function createLabServices(deps: { db: Knex; bands: BandService; threads: ThreadBudget; water: WaterServices }): LabServices {
  const lab = new LabService(deps.db, deps.bands, new LabPool(deps.threads), new CalibrationStore(), deps.water);
  return { lab, waterBalance: new WaterBalanceService(lab, deps.water) };
}
