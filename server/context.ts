import type { Knex } from 'knex';
import type { AppConfig } from './config';
import { AuthService } from './services/auth-service';
import { createTeamServices, type TeamServices, type TeamServicesOptions } from './services/team-services';
import { BandService } from './services/band-service';
import { CatchmentService } from './services/catchment-service';
import { DatasetService } from './services/dataset-service';
import { UploadService } from './services/upload-service';

/** Everything the routes need, built once per app so tests can build their own. */
export interface AppContext extends TeamServices {
  config: AppConfig;
  db: Knex;
  auth: AuthService;
  catchments: CatchmentService;
  bands: BandService;
  datasets: DatasetService;
  uploads: UploadService;
}

export interface ContextOptions extends TeamServicesOptions {
  /** bcrypt work factor; 12 in production, lower locally to keep tests quick. */
  bcryptCost?: number;
}

export function createContext(config: AppConfig, db: Knex, options: ContextOptions = {}): AppContext {
  const bcryptCost = options.bcryptCost ?? (config.env === 'production' ? 12 : 10);
  const auth = new AuthService(db, bcryptCost);
  return {
    config,
    db,
    auth,
    ...createTeamServices(config, db, auth, options),
    catchments: new CatchmentService(),
    bands: new BandService(),
    datasets: new DatasetService(),
    uploads: new UploadService(),
  };
}
