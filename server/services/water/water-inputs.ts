import type { WaterInputs } from '../../../shared/analysis/water-side-inputs';
import type { WaterSettings } from '../../../shared/schemas/water-settings';
import type { BandService } from '../catchments/band-service';
import type { TenantScope } from '../tenant-scope';
import type { ClosureStore } from './closure-store';
import type { GradientService } from './gradient-service';
import type { WaterSettingsStore } from './settings-store';
import { checkAgainstBands } from './settings-store';

/**
 * The water side of a catchment's engine inputs, from its saved settings, its stations' gradients
 * and its newest water-balance closure. Settings saved for another band table are refused here,
 * naming the field, before any run starts.
 */
export class WaterInputSource {
  constructor(
    private readonly bands: BandService,
    private readonly settings: WaterSettingsStore,
    private readonly gradients: GradientService,
    private readonly closures: ClosureStore,
  ) {}

  async inputs(scope: TenantScope, catchmentId: number): Promise<WaterInputs> {
    const catchment = await scope.findOr404<{ station_elevation_m: number }>('catchments', catchmentId, 'Catchment');
    const settings = await this.settings.settings(scope, catchmentId);
    await checkAgainstBands(settings, await this.bands.list(scope, catchmentId), catchment.station_elevation_m);
    const closure = await this.closures.current(scope, catchmentId);
    return {
      gradients: await this.gradients.chosen(scope, catchmentId, settings.gradients),
      closure: closure?.closure.closed ? {
        precipitationFactor: closure.closure.candidate.precipitationFactor, profile: closure.closure.candidate.profile,
        period: closure.closure.period, savedAt: closure.savedAt, savedBy: closure.savedBy, ratio: closure.closure.precipitationRatio.value,
      } : null,
      redistribution: engineRedistribution(settings),
      routing: settings.routing,
      glacier: settings.glacier,
    };
  }
}

function engineRedistribution(settings: WaterSettings): WaterInputs['redistribution'] {
  const { avalanche, windDrift } = settings.redistribution;
  if (!avalanche && !windDrift) return null;
  return { avalanche: avalanche ? { parameters: avalanche.parameters } : null, windDrift };
}
