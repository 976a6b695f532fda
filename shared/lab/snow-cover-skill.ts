import { simulate } from '../melt/simulate';
import { addDays, daysBetween } from '../melt/calendar';
import type { SimulationResult } from '../melt/result';
import { unitsOfRange } from './band-ranges';
import { catchmentInput, forcingDays } from './calibration-set';
import type { LabSite } from './site';
import { skillScoresOrNull, type SkillScores } from './skill-scores';

/** Snow-covered share of one band's cloud-free area on one map date, from a classified snow map. */
export interface SnowCoverObservation {
  date: string;
  lowerM: number;
  upperM: number;
  snowCoveredFraction: number | null;
  /** Share of the band the map saw (cloud-free, with data). */
  validFraction: number;
}

export interface SnowCoverComparison {
  pairs: (SnowCoverObservation & { snowCoveredFraction: number; simulatedFraction: number })[];
  /** Observations left out: dates outside the climate record, bands the table does not have, or too little of the band seen. */
  leftOut: number;
  scores: SkillScores | null;
  meanError: number;
  rmse: number;
  /** Share of pairs on the same side of half cover (snow-covered or mostly bare in both). */
  agreement: number;
}

/** Least share of a band a map must see for the band's snow-covered fraction to count (below it clouds decide too much). */
export const MIN_VALID_FRACTION = 0.3;

/** The engine's daily mean snow-covered share of band b on day d (its sub-band depletion of the snowpack). */
function coverOn(result: SimulationResult, b: number, d: number): number {
  return result.bandDay.snowCoverFraction[b * result.dayCount + d];
}

/**
 * Simulated against observed snow-covered fraction per band and map date: the engine's daily snow
 * cover, area-weighted over a band's response units, against the map's fraction of the band's
 * cloud-free area, for bands the map saw at least MIN_VALID_FRACTION of. Scores over all pairs
 * (NSE, KGE and bias as for discharge; RMSE; and the share on the same side of half cover).
 */
export function compareSnowCover(site: LabSite, observed: readonly SnowCoverObservation[]): SnowCoverComparison {
  const start = site.forcing.start;
  const last = addDays(start, forcingDays(site.forcing) - 1);
  const usable = observed.filter((o) => o.snowCoveredFraction !== null && o.validFraction >= MIN_VALID_FRACTION && o.date >= start && o.date <= last);
  const matched = usable.map((o) => ({ o, units: unitsOfRange(site.catchment.bands, o.lowerM, o.upperM, 'area') })).filter((m) => m.units.length > 0);
  if (matched.length === 0) return { pairs: [], leftOut: observed.length, scores: null, meanError: 0, rmse: 0, agreement: 0 };
  const to = matched.reduce((a, m) => (m.o.date > a ? m.o.date : a), matched[0].o.date);
  const result = simulate(catchmentInput(site, { from: start, to }));
  const pairs = matched.map(({ o, units }) => {
    const d = daysBetween(start, o.date);
    return { ...o, snowCoveredFraction: o.snowCoveredFraction!, simulatedFraction: units.reduce((s, u) => s + u.weight * coverOn(result, u.index, d), 0) };
  });
  const errors = pairs.map((p) => p.simulatedFraction - p.snowCoveredFraction);
  const scores = skillScoresOrNull(pairs.map((p) => p.snowCoveredFraction), pairs.map((p) => p.simulatedFraction));
  return {
    pairs,
    leftOut: observed.length - pairs.length,
    scores,
    meanError: errors.reduce((s, e) => s + e, 0) / errors.length,
    rmse: Math.sqrt(errors.reduce((s, e) => s + e * e, 0) / errors.length),
    agreement: pairs.filter((p) => (p.simulatedFraction >= 0.5) === (p.snowCoveredFraction >= 0.5)).length / pairs.length,
  };
}
