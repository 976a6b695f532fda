import type { CatchmentForm } from '../../shared/schemas/catchments';
import { unique } from './factories';

/** Fields of a valid catchment with a unique name (invented place). */
export function catchmentFields(overrides: Partial<CatchmentForm> = {}): CatchmentForm {
  return {
    name: unique('Test basin '),
    description: 'An invented test catchment.',
    latitudeDeg: 33.2,
    longitudeDeg: 75.4,
    timeZone: 'Asia/Kolkata',
    stationName: 'Test camp',
    stationElevationM: 3100,
    outletDescription: 'Gauge below the snout',
    ...overrides,
  };
}
