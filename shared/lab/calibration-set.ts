import type { Parameters } from '../melt/parameters';
import type { SimulationInput } from '../melt/schema';
import { PARAMETER_SPECS } from '../melt/parameters';
import { labelOf } from '../text/labels';
import type { LabSite, Period } from './site';
import { engineWaterSide, scaledFactor } from '../analysis/water-side-inputs';

/** Parameters a scientist may adjust and the automatic search may vary. */
export const CALIBRATION_KEYS = [
  'lapseRateCPerKm', 'temperatureRangeRadiationCoefficient', 'turbidity', 'iceAlbedo', 'debrisAlbedo', 'freshGrainRadiusUm',
  'precipitationGradientPerKm', 'precipitationFactor', 'rainSnowThresholdC', 'exchangeCoefficient',
] as const;
export type CalibrationKey = (typeof CALIBRATION_KEYS)[number];

export interface KeySpec {
  label: string;
  min: number;
  max: number;
  default: number;
  /** '' for a dimensionless parameter. */
  unit: string;
}

/**
 * The station precipitation factor corrects gauge undercatch and unrepresentative sites; a
 * range of 0.5–2 covers what catchment studies use (common practice [memory]).
 */
const PRECIPITATION_FACTOR: KeySpec = { label: 'Precipitation factor', min: 0.5, max: 2, default: 1, unit: '×' };

export function keySpec(key: CalibrationKey): KeySpec {
  if (key === 'precipitationFactor') return PRECIPITATION_FACTOR;
  const spec = PARAMETER_SPECS[key];
  return { label: spec.label, min: spec.min, max: spec.max, default: spec.default, unit: labelOf(key).unit };
}

/** Parameters in force plus the station precipitation factor: what a catchment's calibration saves. */
export interface CalibrationSet {
  parameters: Partial<Parameters>;
  precipitationFactor: number;
}

export const DEFAULT_CALIBRATION_SET: CalibrationSet = Object.freeze({ parameters: {}, precipitationFactor: 1 });

export function valueOf(set: CalibrationSet, key: CalibrationKey): number {
  if (key === 'precipitationFactor') return set.precipitationFactor;
  return set.parameters[key] ?? PARAMETER_SPECS[key].default;
}

export function withValues(set: CalibrationSet, keys: readonly CalibrationKey[], values: readonly number[]): CalibrationSet {
  const next: CalibrationSet = { parameters: { ...set.parameters }, precipitationFactor: set.precipitationFactor };
  keys.forEach((key, i) => {
    if (key === 'precipitationFactor') next.precipitationFactor = values[i];
    else next.parameters[key] = values[i];
  });
  return next;
}

export function siteWith(site: LabSite, set: CalibrationSet): LabSite {
  return { ...site, parameters: set.parameters, precipitationFactor: set.precipitationFactor };
}

/** Last date of the forcing, YYYY-MM-DD. */
export function forcingDays(forcing: LabSite['forcing']): number {
  return forcing.timeStep === 'hourly' ? Math.floor(forcing.temperatureC.length / 24) : forcing.tMinC.length;
}

/**
 * The whole catchment as the engine takes it, with the site's parameters and precipitation
 * factor, and its water side (band climate, redistribution, routing) when the site has one.
 */
export function catchmentInput(site: LabSite, period: Period, scenario: SimulationInput['scenario'] = {}): SimulationInput {
  const parameters = site.parameters ?? {};
  const { precipitationScale, ...water } = site.water ? engineWaterSide(site.catchment, site.water, parameters, site.useClosure ?? false) : { precipitationScale: 1 };
  const merged = { precipitationFactor: site.precipitationFactor ?? 1, ...scenario };
  return {
    catchment: site.catchment,
    forcing: site.forcing,
    parameters,
    scenario: { ...merged, precipitationFactor: scaledFactor(merged.precipitationFactor, precipitationScale) },
    period,
    ...water,
  };
}
