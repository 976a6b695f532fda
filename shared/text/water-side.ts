import type { PrecipitationProfile } from '../hydrology/precipitation-profile';
import { formatNumber } from './numbers';

/**
 * Plain words for the catchment's water side (gradients, precipitation profiles, redistribution,
 * routing), one wording for every screen, export and briefing.
 */

const percentPerKm = (fraction: number) => `${fraction >= 0 ? '+' : '−'}${formatNumber(Math.abs(fraction) * 100, 0)} % per km`;

/**
 * A precipitation profile in words.
 * @example profileText({ kind: 'peaked', peakElevationM: 5200, gradientBelowPerKm: 0.6, decreaseAbovePerKm: 0.3 }) // 'rising +60 % per km to a maximum at 5200 m, falling 30 % of the maximum per km above'
 */
export function profileText(profile: PrecipitationProfile): string {
  if (profile.kind === 'linear') return `linear, ${percentPerKm(profile.gradientPerKm)} above the reference station`;
  return `rising ${percentPerKm(profile.gradientBelowPerKm)} to a maximum at ${formatNumber(profile.peakElevationM, 0)} m, `
    + `falling ${formatNumber(profile.decreaseAbovePerKm * 100, 0)} % of the maximum per km above`;
}

/** A lapse rate in words, K per km with a real minus sign. */
export const lapseRateText = (kPerKm: number) => `${formatNumber(kPerKm, 2)} °C per km`;

/** Where the runs' precipitation comes from, as a scenario option says it. */
export const PRECIPITATION_SOURCE_LABELS = {
  station: 'The station record (× the precipitation factor)',
  'water-balance': 'The water-balance precipitation (the factor and profile that close the catchment\'s water balance)',
} as const;

/** The terms of a catchment water balance, in the order tables and charts show them (mm over the catchment). */
export const BALANCE_TERM_LABELS = {
  precipitationMm: 'Precipitation',
  evaporationSublimationMm: 'Evaporation and sublimation',
  snowStorageChangeMm: 'Change in snow storage',
  iceStorageChangeMm: 'Change in glacier ice storage',
  storesChangeMm: 'Change in water held in the routing stores',
  modelledRunoffMm: 'Modelled runoff',
  measuredRunoffMm: 'Measured runoff',
  closureMm: 'Left open (P − E − ΔS − measured runoff)',
} as const;
