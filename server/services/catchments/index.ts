import { BandService } from './band-service';
import { CatchmentService } from './catchment-service';
import { DatasetService } from './dataset-service';
import { UploadSlots } from '../../middleware/upload-slots';
import type { ThreadBudget } from '../thread-budget';
import { UploadPool } from './upload-pool';
import { UploadService } from './upload-service';

export interface CatchmentServices {
  catchments: CatchmentService;
  bands: BandService;
  datasets: DatasetService;
  uploads: UploadService;
  /** Uploads in progress per organisation (server/middleware/upload-slots.ts). */
  uploadSlots: UploadSlots;
}

/** Catchments with their baseline, band tables, stored series and CSV uploads (read on the shared worker threads). */
export function createCatchmentServices(deps: { threads: ThreadBudget; uploadsPerOrganisation: number }): CatchmentServices {
  return {
    catchments: new CatchmentService(), bands: new BandService(), datasets: new DatasetService(), uploads: new UploadService(new UploadPool(deps.threads)),
    uploadSlots: new UploadSlots(deps.uploadsPerOrganisation),
  };
}
