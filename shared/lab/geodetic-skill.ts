import { simulate } from '../melt/simulate';
import { addDays, daysBetween } from '../melt/calendar';
import type { SimulationResult } from '../melt/result';
import { unitsOfRange } from './band-ranges';
import { catchmentInput, forcingDays } from './calibration-set';
import type { LabSite, Period } from './site';
import { skillScoresOrNull, type SkillScores } from './skill-scores';

/** The geodetic balance of one band's glacier between two surveys, m w.e. per year, with its 1 σ. */
export interface GeodeticObservation {
  fromDate: string;
  toDate: string;
  lowerM: number;
  upperM: number;
  glacierAreaKm2: number;
  balanceMwePerYear: number;
  sigmaMwePerYear: number;
}

export interface GeodeticComparison {
  /** The simulated stretch: the surveys' span within the record, or the record's whole years when they do not overlap by a year. */
  period: Period;
  /** True when the surveys' span and the simulated stretch differ (the record years stand for the survey period). */
  periodsDiffer: boolean;
  rows: (GeodeticObservation & { simulatedMwePerYear: number })[];
  leftOut: number;
  /**
   * Glacier-area-weighted means over the compared bands: the like-for-like comparison, since ice
   * flow moves mass between bands but integrates to zero over the glacier. Its σ is the
   * area-weighted band σ, the bands' errors taken as fully correlated (density and datum errors
   * are shared by every band; the cautious bound).
   */
  glacierWide: { observedMwePerYear: number; simulatedMwePerYear: number; sigmaMwePerYear: number };
  scores: SkillScores | null;
  meanError: number;
  rmse: number;
  /** Share of bands whose simulated balance lies within 2 σ of the geodetic one. */
  withinTwoSigma: number;
}

const DAYS_PER_YEAR = 365.25;

/** The same calendar day n years later (29 February becomes 1 March). */
function yearsLater(date: string, n: number): string {
  const d = new Date(`${date}T00:00:00Z`);
  d.setUTCFullYear(d.getUTCFullYear() + n);
  return d.toISOString().slice(0, 10);
}

/**
 * Simulated glacier balance of band b from day d0 to d1 (both included), m w.e. per year over its
 * glacier area: the change of the snowpack's water minus the glacier ice lost (clean and
 * debris-covered melt, and vapour loss from the ice) per unit glacier area, as for
 * stakes (Cogley et al. 2011 [memory]), divided by the years.
 */
function bandBalance(r: SimulationResult, b: number, glacierFraction: number, d0: number, d1: number): number {
  const { sweMm, iceMeltMm, debrisIceMeltMm, iceVapourLossMm } = r.bandDay;
  const at = (d: number) => b * r.dayCount + d;
  const before = d0 > 0 ? sweMm[at(d0 - 1)] : r.bandTotals.sweStartMm[b];
  let iceLost = 0;
  for (let d = d0; d <= d1; d++) iceLost += iceMeltMm[at(d)] + debrisIceMeltMm[at(d)] + iceVapourLossMm[at(d)];
  return (sweMm[at(d1)] - before - iceLost / glacierFraction) / 1000 / ((d1 - d0 + 1) / DAYS_PER_YEAR);
}

/**
 * Simulated against geodetic glacier balance by elevation band (the balance profile): the mean
 * annual balance of each band's glacier over the surveys' span within the climate record, or over
 * the record's whole years when the two overlap by less than a year (then the record stands for the
 * survey period, which the result says). Response units of a band are weighted by glacier area.
 * Scores across bands: NSE and KGE of the profile, mean error, RMSE, and the share within 2 σ.
 */
export function compareGeodetic(site: LabSite, observed: readonly GeodeticObservation[]): GeodeticComparison {
  if (observed.length === 0) throw new RangeError('no geodetic balance to compare with');
  const start = site.forcing.start;
  const days = forcingDays(site.forcing);
  const last = addDays(start, days - 1);
  const from = observed[0].fromDate > start ? observed[0].fromDate : start;
  const to = observed[0].toDate < last ? observed[0].toDate : last;
  const overlaps = to >= from && daysBetween(from, to) + 1 >= 365;
  let years = 0;
  while (daysBetween(start, yearsLater(start, years + 1)) <= days) years++;
  if (!overlaps && years < 1) throw new RangeError('the climate record is shorter than a year, too short for a mean annual balance');
  const period = overlaps ? { from, to } : { from: start, to: addDays(yearsLater(start, years), -1) };
  const result = simulate(catchmentInput(site, { from: start, to: period.to }));
  const d0 = daysBetween(start, period.from);
  const d1 = daysBetween(start, period.to);
  const rows = observed.flatMap((o) => {
    const units = unitsOfRange(site.catchment.bands, o.lowerM, o.upperM, 'glacier');
    if (units.length === 0) return [];
    const simulated = units.reduce((s, u) => s + u.weight * bandBalance(result, u.index, site.catchment.bands[u.index].glacierFraction, d0, d1), 0);
    return [{ ...o, simulatedMwePerYear: simulated }];
  });
  const area = rows.reduce((s, r) => s + r.glacierAreaKm2, 0);
  const wide = (pick: (r: (typeof rows)[number]) => number) => (area > 0 ? rows.reduce((s, r) => s + r.glacierAreaKm2 * pick(r), 0) / area : 0);
  const errors = rows.map((r) => r.simulatedMwePerYear - r.balanceMwePerYear);
  const scores = skillScoresOrNull(rows.map((r) => r.balanceMwePerYear), rows.map((r) => r.simulatedMwePerYear));
  const n = Math.max(1, rows.length);
  return {
    period,
    periodsDiffer: period.from !== observed[0].fromDate || period.to !== observed[0].toDate,
    rows,
    leftOut: observed.length - rows.length,
    glacierWide: { observedMwePerYear: wide((r) => r.balanceMwePerYear), simulatedMwePerYear: wide((r) => r.simulatedMwePerYear), sigmaMwePerYear: wide((r) => r.sigmaMwePerYear) },
    scores,
    meanError: errors.reduce((s, e) => s + e, 0) / n,
    rmse: Math.sqrt(errors.reduce((s, e) => s + e * e, 0) / n),
    withinTwoSigma: rows.filter((r) => Math.abs(r.simulatedMwePerYear - r.balanceMwePerYear) <= 2 * r.sigmaMwePerYear).length / n,
  };
}
