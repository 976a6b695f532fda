import type { Parameters } from '../melt/parameters';
import type { SimulationInput } from '../melt/schema';
import { engineWaterSide, type WaterInputs } from '../analysis/water-side-inputs';

/** The catchment and its climate as the engine takes them. */
export type CatchmentInput = SimulationInput['catchment'];
export type ForcingInput = SimulationInput['forcing'];
export type BandInput = CatchmentInput['bands'][number];

/** A dated stretch of days, both ends included, YYYY-MM-DD. */
export interface Period {
  from: string;
  to: string;
}

/** What every lab computation starts from: a catchment, its forcing and the parameters in force. */
export interface LabSite {
  catchment: CatchmentInput;
  forcing: ForcingInput;
  /** Parameters in force (calibrated or default); missing names take the engine's defaults. */
  parameters?: Partial<Parameters>;
  /** Station precipitation multiplier in force (calibrated or 1). */
  precipitationFactor?: number;
  /** The catchment's water side: gradients, closure, redistribution, routing; none: the engine's own behaviour. */
  water?: WaterInputs;
  /** Use the saved water-balance precipitation (closure) instead of the station's. */
  useClosure?: boolean;
}

/** The band a surface-response curve is computed for, and when. */
export interface BandSite extends LabSite {
  bandIndex: number;
  period: Period;
}

export function selectedBand(site: BandSite): BandInput {
  const band = site.catchment.bands[site.bandIndex];
  if (!band) throw new RangeError(`band ${site.bandIndex} does not exist; the catchment has ${site.catchment.bands.length} band(s)`);
  return band;
}

/** The forcing with every precipitation value set to 0, so surfaces stay as they were set up. */
export function withoutPrecipitation(forcing: ForcingInput): ForcingInput {
  return { ...forcing, precipitationMm: forcing.precipitationMm.map(() => 0) };
}

/**
 * One engine input where every "surface" is a copy of the chosen band (same elevation, slope and
 * aspect, hence the same weather) with its own glacier and debris cover. Precipitation is left
 * out so each surface keeps its cover through the period.
 */
export function surfacesInput(site: BandSite, surfaces: Partial<BandInput>[], initialSweMm: number[], extra: Pick<SimulationInput, 'scenario'> = {}): SimulationInput {
  const band = selectedBand(site);
  const catchment = { ...site.catchment, bands: surfaces.map((s) => ({ ...band, ...s })) };
  // The surfaces are copies of one band, not neighbours: they share its climate but exchange no snow.
  const { bandClimate } = site.water ? engineWaterSide(catchment, { ...site.water, redistribution: null, routing: null }, site.parameters ?? {}, false) : { bandClimate: undefined };
  return {
    catchment,
    forcing: withoutPrecipitation(site.forcing),
    parameters: site.parameters ?? {},
    period: site.period,
    initialState: { sweMm: initialSweMm },
    ...(bandClimate ? { bandClimate } : {}),
    ...extra,
  };
}

/** n values from `from` to `to`, evenly spaced on a log scale. */
export function logSpaced(from: number, to: number, n: number): number[] {
  if (!(from > 0 && to > from && n >= 2)) throw new RangeError('logSpaced: need 0 < from < to and at least 2 values');
  const step = Math.log(to / from) / (n - 1);
  return Array.from({ length: n }, (_, i) => (i === n - 1 ? to : from * Math.exp(step * i)));
}
