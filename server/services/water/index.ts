import type { BandService } from '../catchments/band-service';
import { ClosureStore } from './closure-store';
import { GradientService } from './gradient-service';
import { WaterSettingsStore } from './settings-store';
import { WaterInputSource } from './water-inputs';

export interface WaterServices {
  waterSettings: WaterSettingsStore;
  gradients: GradientService;
  closures: ClosureStore;
  waterInputs: WaterInputSource;
}

/** The catchment's water side: settings, vertical gradients from its stations, saved water-balance closures, and the engine inputs they make. */
export function createWaterServices(deps: { bands: BandService }): WaterServices {
  const waterSettings = new WaterSettingsStore(deps.bands);
  const gradients = new GradientService(deps.bands);
  const closures = new ClosureStore();
  return { waterSettings, gradients, closures, waterInputs: new WaterInputSource(deps.bands, waterSettings, gradients, closures) };
}
