import type { BandService } from '../catchments/band-service';
import type { DatasetService } from '../catchments/dataset-service';
import { StationComparisonService } from './station-comparison';
import { StationService } from './station-service';

export interface StationServices {
  stations: StationService;
  stationComparison: StationComparisonService;
}

/** Several stations per catchment, and comparisons of their overlapping records. */
export function createStationServices(deps: { bands: BandService; datasets: DatasetService }): StationServices {
  return { stations: new StationService(deps.bands), stationComparison: new StationComparisonService(deps.datasets) };
}
