import { requireLength } from './errors';
import { fitMonthlyLapseRates, type MonthlyLapseRate } from './lapse-rate';
import { fitLinearProfile, fitPeakedProfile, type PeakedFitOptions, type ProfileFit, type ProfilePoint } from './precipitation-fit';
import type { PrecipitationProfile } from './precipitation-profile';
import { checkStations, MONTHS, MONTH_NAMES, type ElevationBand, type StationClimate } from './stations';

export type PrecipitationFitChoice =
  | { kind: 'linear'; perMonth: boolean; assumedGradientPerKm: number }
  | { kind: 'peaked'; perMonth: boolean; fixed?: PeakedFitOptions };

export interface StationGradientsInput {
  stations: readonly StationClimate[];
  bands: readonly ElevationBand[];
  referenceElevationM: number;
  /** Lapse rate for months with fewer than two stations, K km⁻¹ (e.g. −6.5, the ICAO standard atmosphere). */
  assumedLapseRateKPerKm: number;
  precipitation: PrecipitationFitChoice;
}

export interface StationGradients {
  lapseRates: MonthlyLapseRate[];
  /** Twelve fits (per month) or one (annual totals, used for every month). */
  precipitationFits: ProfileFit[];
  precipitationPerMonth: boolean;
}

/** Stations' precipitation for one month (0–11), or their annual totals (complete years only) for `'annual'`. */
function precipitationPoints(stations: readonly StationClimate[], month: number | 'annual'): ProfilePoint[] {
  return stations.flatMap((s) => {
    const values = s.monthlyPrecipitationMm;
    if (!values) return [];
    if (month !== 'annual') {
      const p = values[month];
      return p === null || p === undefined ? [] : [{ elevationM: s.elevationM, precipitationMm: p }];
    }
    if (values.some((v) => v === null)) return [];
    return [{ elevationM: s.elevationM, precipitationMm: (values as number[]).reduce((a, v) => a + v, 0) }];
  });
}

/**
 * Fits the month-by-month lapse rate and the precipitation profile from the stations. Stations
 * are checked first (a station above the catchment's top is refused).
 * @throws HydrologyInputError naming the station field or the month whose fit is not possible
 * @example fitStationGradients({ stations, bands, referenceElevationM: 2100, assumedLapseRateKPerKm: -6.5, precipitation: { kind: 'peaked', perMonth: false } }).lapseRates[6].lapseRateKPerKm // July, K km⁻¹
 */
export function fitStationGradients(input: StationGradientsInput): StationGradients {
  const { stations, bands, referenceElevationM: zRef, precipitation } = input;
  checkStations(stations, bands);
  const lapseRates = fitMonthlyLapseRates(stations, input.assumedLapseRateKPerKm);
  const periods: (number | 'annual')[] = precipitation.perMonth ? Array.from({ length: MONTHS }, (_, m) => m) : ['annual'];
  const precipitationFits = periods.map((period) => {
    const points = precipitationPoints(stations, period);
    const path = `stations (precipitation, ${period === 'annual' ? 'annual totals of complete years' : MONTH_NAMES[period]})`;
    return precipitation.kind === 'linear'
      ? fitLinearProfile(points, zRef, precipitation.assumedGradientPerKm, path)
      : fitPeakedProfile(points, zRef, precipitation.fixed ?? {}, path);
  });
  return { lapseRates, precipitationFits, precipitationPerMonth: precipitation.perMonth };
}

/** Hand-set values for some months (null or absent: keep the fitted or assumed value). */
export interface MonthlyOverrides {
  lapseRatesKPerKm?: readonly (number | null)[];
  profiles?: readonly (PrecipitationProfile | null)[];
}

export type GradientOrigin = 'fitted' | 'assumed' | 'set by hand';

export interface ChosenGradients {
  lapseRatesKPerKm: number[];
  profiles: PrecipitationProfile[];
  lapseRateOrigin: GradientOrigin[];
  profileOrigin: GradientOrigin[];
}

/**
 * The twelve lapse rates and profiles a band climate is built from: fitted values, replaced month
 * by month where the user set one by hand.
 * @throws HydrologyInputError when an override list does not have twelve entries
 */
export function chooseMonthlyGradients(fitted: StationGradients, overrides: MonthlyOverrides = {}): ChosenGradients {
  for (const key of ['lapseRatesKPerKm', 'profiles'] as const) {
    const list = overrides[key];
    if (list) requireLength(list, MONTHS, `overrides.${key}`, 'January first, empty for months kept as fitted');
  }
  const months = Array.from({ length: MONTHS }, (_, m) => m);
  const profileFit = (m: number) => fitted.precipitationFits[fitted.precipitationPerMonth ? m : 0];
  return {
    lapseRatesKPerKm: months.map((m) => overrides.lapseRatesKPerKm?.[m] ?? fitted.lapseRates[m].lapseRateKPerKm),
    profiles: months.map((m) => overrides.profiles?.[m] ?? profileFit(m).profile),
    lapseRateOrigin: months.map((m) => (overrides.lapseRatesKPerKm?.[m] != null ? 'set by hand' : fitted.lapseRates[m].status)),
    profileOrigin: months.map((m) => (overrides.profiles?.[m] != null ? 'set by hand' : profileFit(m).status)),
  };
}
