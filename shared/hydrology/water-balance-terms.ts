import { HydrologyInputError, refuse } from './errors';
import type { ElevationBand } from './stations';

/**
 * The terms of a catchment water balance and the measurements it is closed against
 * (P − E − ΔS_snow − ΔS_ice = R, mm w.e. over the catchment area unless stated).
 */

/** The model's water balance over the period, for one candidate. */
export interface ModelledBalance {
  /** Catchment-mean precipitation, mm w.e. over the catchment area. */
  precipitationMm: number;
  /** Catchment runoff, mm over the catchment area. */
  runoffMm: number;
  /** Evaporation and sublimation, mm w.e. over the catchment area. */
  evaporationSublimationMm: number;
  /** Change of snow storage (end − start; positive = gained), mm w.e. over the catchment area. */
  snowStorageChangeMm: number;
  /** Change of glacier ice and firn storage (positive = gained), mm w.e. over the catchment area. */
  iceStorageChangeMm: number;
  /** With runoff routing: change of the water held in the routing stores (soil, channels, groundwater), mm over the catchment area. */
  storesChangeMm?: number;
  /** Glacier-wide mass balance, mm w.e. over the glacier area; needed when one is measured. */
  glacierMassBalanceMm?: number;
  /** Mass balance of the glacier part of each band, mm w.e. over that part; needed for band balances. */
  bandGlacierBalanceMm?: ArrayLike<number>;
  /** Precipitation per band, mm (for the chart of station against inferred precipitation). */
  bandPrecipitationMm?: ArrayLike<number>;
}

/** A measured value with its stated accuracy, taken as one standard uncertainty (1σ). */
export interface Measured {
  value: number;
  uncertainty: number;
}

export interface BalanceObservations {
  /** Measured runoff over the period, mm over the catchment area. */
  runoffMm: Measured;
  /** Measured glacier-wide mass balance over the period, mm w.e. */
  glacierMassBalanceMm?: Measured;
  /** Measured glacier balances in single bands (e.g. from stakes), mm w.e. */
  bandBalances?: (Measured & { band: number })[];
}

export interface BalanceTerms {
  precipitationMm: number;
  measuredRunoffMm: number;
  modelledRunoffMm: number;
  evaporationSublimationMm: number;
  snowStorageChangeMm: number;
  iceStorageChangeMm: number;
  /** Change of the water in the routing stores (0 without routing). */
  storesChangeMm: number;
  /** P − E − ΔS_snow − ΔS_ice − ΔS_stores − measured R: what the balance leaves open, mm. */
  closureMm: number;
}

export interface Observation {
  label: string;
  path: string;
  measured: Measured;
  modelled: (m: ModelledBalance) => number | undefined;
}

/** The observations as one list, checked: each needs a number and a stated accuracy above 0. */
export function observationList(obs: BalanceObservations, bands: readonly ElevationBand[]): Observation[] {
  const bandCount = bands.length;
  const list: Observation[] = [{ label: 'runoff', path: 'observations.runoffMm', measured: obs.runoffMm, modelled: (m) => m.runoffMm }];
  if (obs.glacierMassBalanceMm) list.push({ label: 'glacier mass balance', path: 'observations.glacierMassBalanceMm', measured: obs.glacierMassBalanceMm, modelled: (m) => m.glacierMassBalanceMm });
  (obs.bandBalances ?? []).forEach((b, i) => {
    if (!(Number.isInteger(b.band) && b.band >= 0 && b.band < bandCount)) refuse(`observations.bandBalances[${i}].band`, `band ${b.band} does not exist (there are ${bandCount}).`);
    list.push({ label: `glacier balance at ${bands[b.band].lowerM}–${bands[b.band].upperM} m`, path: `observations.bandBalances[${i}]`, measured: b, modelled: (m) => m.bandGlacierBalanceMm?.[b.band] });
  });
  const issues = list.flatMap((o) => [
    ...(Number.isFinite(o.measured.value) ? [] : [{ path: `${o.path}.value`, message: `the measured ${o.label} must be a number.` }]),
    ...(o.measured.uncertainty > 0 && Number.isFinite(o.measured.uncertainty) ? [] : [{ path: `${o.path}.uncertainty`, message: `the measured ${o.label} needs a stated accuracy greater than 0.` }]),
  ]);
  if (!(obs.runoffMm.value > 0)) issues.push({ path: 'observations.runoffMm.value', message: 'the measured runoff must be greater than 0 mm.' });
  if (issues.length > 0) throw new HydrologyInputError(issues);
  return list;
}

/** The balance terms of a model run against the measured runoff. */
export function termsOf(m: ModelledBalance, measuredRunoffMm: number): BalanceTerms {
  return {
    precipitationMm: m.precipitationMm,
    measuredRunoffMm,
    modelledRunoffMm: m.runoffMm,
    evaporationSublimationMm: m.evaporationSublimationMm,
    snowStorageChangeMm: m.snowStorageChangeMm,
    iceStorageChangeMm: m.iceStorageChangeMm,
    storesChangeMm: m.storesChangeMm ?? 0,
    closureMm: m.precipitationMm - m.evaporationSublimationMm - m.snowStorageChangeMm - m.iceStorageChangeMm - (m.storesChangeMm ?? 0) - measuredRunoffMm,
  };
}
