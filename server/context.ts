import type { Knex } from 'knex';
import type { AppConfig } from './config';
import { AuthService } from './services/auth/auth-service';
import { createTeamServices, type TeamServices, type TeamServicesOptions } from './services/team-services';
import { BandService } from './services/catchments/band-service';
import { CatchmentService } from './services/catchments/catchment-service';
import { DatasetService } from './services/catchments/dataset-service';
import { UploadService } from './services/catchments/upload-service';
import { LabService } from './services/lab/lab-service';
import { LabPool } from './services/lab/lab-pool';
import { createRunServices, type RunServices, type RunServicesOptions } from './services/runs/run-services';
import { createBriefingServices, type BriefingServices, type BriefingServicesOptions } from './services/briefings/briefing-services';

/** Everything the routes need, built once per app so tests can build their own. */
export interface AppContext extends TeamServices, RunServices, BriefingServices {
  config: AppConfig;
  db: Knex;
  auth: AuthService;
  catchments: CatchmentService;
  bands: BandService;
  datasets: DatasetService;
  uploads: UploadService;
  lab: LabService;
}

export interface ContextOptions extends TeamServicesOptions, RunServicesOptions, BriefingServicesOptions {
  /** bcrypt work factor; 12 in production, lower locally to keep tests quick. */
  bcryptCost?: number;
  /** Worker threads for the lab's computations; one less than the cores by default. */
  labThreads?: number;
}

export function createContext(config: AppConfig, db: Knex, options: ContextOptions = {}): AppContext {
  const bcryptCost = options.bcryptCost ?? (config.env === 'production' ? 12 : 10);
  const auth = new AuthService(db, bcryptCost);
  const bands = new BandService();
  const team = createTeamServices(config, db, auth, options);
  const runServices = createRunServices(config, db, bands, options);
  return {
    config,
    db,
    auth,
    ...team,
    catchments: new CatchmentService(),
    bands,
    datasets: new DatasetService(),
    uploads: new UploadService(),
    lab: new LabService(db, new BandService(), new LabPool(options.labThreads)),
    ...runServices,
    ...createBriefingServices({ results: runServices.results, invitations: team.invitations }, options),
  };
}
