import { BandService } from './band-service';
import { CatchmentService } from './catchment-service';
import { DatasetService } from './dataset-service';
import { UploadService } from './upload-service';

export interface CatchmentServices {
  catchments: CatchmentService;
  bands: BandService;
  datasets: DatasetService;
  uploads: UploadService;
}

/** Catchments with their baseline, band tables, stored series and CSV uploads. */
export function createCatchmentServices(): CatchmentServices {
  return { catchments: new CatchmentService(), bands: new BandService(), datasets: new DatasetService(), uploads: new UploadService() };
}
