import { bandClimate } from '../../../shared/hydrology/band-climate';
import { fitMonthlyLapseRates } from '../../../shared/hydrology/lapse-rate';
import { chooseMonthlyGradients, fitStationGradients, type StationGradients } from '../../../shared/hydrology/station-gradients';
import { MONTH_NAMES, type StationClimate } from '../../../shared/hydrology/stations';
import type { WaterInputs } from '../../../shared/analysis/water-side-inputs';
import type { GradientsReply } from '../../../shared/schemas/gradients';
import type { GradientSettings } from '../../../shared/schemas/water-settings';
import { validationFailed } from '../../errors';
import type { BandService } from '../catchments/band-service';
import type { StationRow } from '../stations/station-rows';
import type { TenantScope } from '../tenant-scope';
import { csvFile, type DownloadFile } from '../download-file';
import { gradientsCsv } from './gradients-csv';
import { refusingInput } from './hydrology-errors';
import { stationClimatologies, type Climatologies } from './station-climate';

const hasPrecipitation = (c: StationClimate) => c.monthlyPrecipitationMm?.some((v) => v !== null) ?? false;
const hasTemperature = (c: StationClimate) => c.monthlyTemperatureC?.some((v) => v !== null) ?? false;
const annual = (values: readonly (number | null)[] | undefined) => (values && values.every((v) => v !== null) ? (values as number[]).reduce((a, v) => a + v, 0) : null);

/**
 * The vertical gradients of a catchment from its stations: fitted over the stations' common
 * period with the chosen profile form, completed by hand-set months, and turned into the band
 * climate the engine takes. With one station every month says its gradient is assumed, not fitted.
 */
export class GradientService {
  constructor(private readonly bands: BandService) {}

  async fit(scope: TenantScope, catchmentId: number, settings: GradientSettings, inUse: boolean): Promise<GradientsReply> {
    const { catchment, bands, climatologies } = await this.load(scope, catchmentId);
    const zRef = catchment.station_elevation_m;
    const climates = climatologies.stations.map((s) => s.climate);
    const fitted = await this.fitted(climates, bands, zRef, settings);
    const chosen = await refusingInput(() => chooseMonthlyGradients(fitted, settings.overrides), 'gradients');
    const damping = settings.damping ? this.damping(climatologies, settings) : null;
    const climate = await refusingInput(() => bandClimate({ bands, referenceElevationM: zRef, lapseRatesKPerKm: chosen.lapseRatesKPerKm, profiles: chosen.profiles, ...(damping ? { glacierDamping: damping } : {}) }), 'gradients');
    const notes = [...climatologies.notes];
    if (climates.filter(hasTemperature).length < 2) notes.push('Only one station has air temperature: the lapse rates are assumed, not fitted. Add a station at another elevation to fit them.');
    if (climates.filter(hasPrecipitation).length < 2) notes.push('Fewer than two stations have precipitation: the precipitation gradient is assumed, not fitted.');
    return {
      referenceElevationM: zRef,
      stations: climatologies.stations.map(({ station, climate: c }) => ({
        id: station.id, name: station.name, network: station.network, elevationM: station.elevation_m, isReference: Boolean(station.is_reference),
        monthlyTemperatureC: c.monthlyTemperatureC ? [...c.monthlyTemperatureC] : null,
        monthlyPrecipitationMm: c.monthlyPrecipitationMm ? [...c.monthlyPrecipitationMm] : null,
        annualPrecipitationMm: annual(c.monthlyPrecipitationMm),
      })),
      periods: climatologies.periods,
      lapseRates: fitted.lapseRates,
      precipitationFits: fitted.precipitationFits.map((f, i) => ({
        ...f, label: fitted.precipitationPerMonth ? MONTH_NAMES[i] : 'Annual totals', standardErrors: { ...f.standardErrors } as Record<string, number | null>,
      })),
      precipitationPerMonth: fitted.precipitationPerMonth,
      chosen,
      bands: bands.map((b) => ({ midM: (b.lowerM + b.upperM) / 2, areaKm2: b.areaKm2, glacierFraction: b.glacierFraction })),
      bandClimate: {
        temperatureOffsetK: Array.from(climate.temperatureOffsetK), glacierTemperatureOffsetK: Array.from(climate.glacierTemperatureOffsetK),
        precipitationMultiplier: Array.from(climate.precipitationMultiplier),
      },
      inUse,
      notes,
    };
  }

  /** Refuses settings whose gradients cannot be fitted or applied (before they are saved). */
  async check(scope: TenantScope, catchmentId: number, settings: GradientSettings): Promise<void> {
    if (settings.use) await this.chosen(scope, catchmentId, settings);
  }

  /** The fit as a CSV download: month by month, then the stations' climatologies. */
  async csvFile(scope: TenantScope, catchmentId: number, settings: GradientSettings): Promise<DownloadFile> {
    return csvFile(`catchment-${catchmentId}-gradients.csv`, gradientsCsv(await this.fit(scope, catchmentId, settings, settings.use)));
  }

  /** The gradients runs take, or null when the catchment does not use them. */
  async chosen(scope: TenantScope, catchmentId: number, settings: GradientSettings): Promise<WaterInputs['gradients']> {
    if (!settings.use) return null;
    const { catchment, bands, climatologies } = await this.load(scope, catchmentId);
    const fitted = await this.fitted(climatologies.stations.map((s) => s.climate), bands, catchment.station_elevation_m, settings);
    const chosen = await refusingInput(() => chooseMonthlyGradients(fitted, settings.overrides), 'gradients');
    return {
      lapseRatesKPerKm: chosen.lapseRatesKPerKm, profiles: chosen.profiles, damping: settings.damping ? this.damping(climatologies, settings) : null,
      origin: { lapseRate: chosen.lapseRateOrigin, profile: chosen.profileOrigin, stationCount: climatologies.stations.filter((s) => hasTemperature(s.climate) || hasPrecipitation(s.climate)).length },
    };
  }

  private async load(scope: TenantScope, catchmentId: number) {
    const catchment = await scope.findOr404<{ station_elevation_m: number }>('catchments', catchmentId, 'Catchment');
    const bands = await this.bands.list(scope, catchmentId);
    if (bands.length === 0) throw validationFailed('bands: the catchment has no elevation bands yet; gradients are applied to bands.', 'bands');
    const stations = await scope.from<StationRow>('stations').where('catchment_id', catchmentId).orderBy('elevation_m');
    return { catchment, bands, climatologies: await stationClimatologies(scope, catchmentId, stations) };
  }

  private async fitted(climates: StationClimate[], bands: Awaited<ReturnType<BandService['list']>>, zRef: number, settings: GradientSettings): Promise<StationGradients> {
    const precipitation = settings.precipitationForm === 'linear'
      ? { kind: 'linear' as const, perMonth: settings.perMonth, assumedGradientPerKm: settings.assumedGradientPerKm }
      : { kind: 'peaked' as const, perMonth: settings.perMonth, fixed: settings.fixed };
    const withPrecipitation = climates.filter(hasPrecipitation);
    if (withPrecipitation.length > 0) {
      return refusingInput(() => fitStationGradients({ stations: climates, bands, referenceElevationM: zRef, assumedLapseRateKPerKm: settings.assumedLapseRateKPerKm, precipitation }), 'gradients');
    }
    // No station has precipitation: the lapse rates are still fitted, the profile is assumed.
    const lapseRates = await refusingInput(() => fitMonthlyLapseRates(climates, settings.assumedLapseRateKPerKm), 'gradients');
    const assumed = { kind: 'linear' as const, gradientPerKm: settings.assumedGradientPerKm };
    return {
      lapseRates,
      precipitationFits: [{ profile: assumed, referencePrecipitationMm: 0, standardErrors: {}, r2: null, n: 0, status: 'assumed', notes: ['Assumed, not fitted: no station has precipitation.'] }],
      precipitationPerMonth: false,
    };
  }

  /** Damping is evaluated at the reference station's mean temperature of each month; a month without one is not damped. */
  private damping(climatologies: Climatologies, settings: GradientSettings) {
    const reference = climatologies.stations.find((s) => s.station.is_reference);
    const temperatures = reference?.climate.monthlyTemperatureC;
    if (!temperatures || temperatures.every((t) => t === null)) {
      throw validationFailed('gradients.damping: on-glacier damping needs the reference station’s monthly air temperatures; upload its temperature first.', 'gradients.damping');
    }
    // Below 0 °C at the glacier top the damping does nothing, so −30 °C stands for "no value".
    return { ...settings.damping!, referenceMonthlyTemperatureC: temperatures.map((t) => t ?? -30) };
  }
}
