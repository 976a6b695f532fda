import { simulate } from '../melt/simulate';
import { addDays, daysBetween } from '../melt/calendar';
import { catchmentInput, forcingDays } from './calibration-set';
import { skillScores, type SkillScores } from './skill-scores';
import type { CatchmentInput, LabSite } from './site';

/** One stake reading: the surface mass balance of a point over a period, m w.e. */
export interface StakeObservation {
  stake: string;
  elevationM: number;
  from: string;
  to: string;
  balanceMWe: number;
}

export interface StakeComparison {
  readings: (StakeObservation & { bandIndex: number; simulatedMWe: number })[];
  /** Readings left out because their period is not inside the climate record. */
  outsideRecord: number;
  /** Null with fewer than two readings or when the skill cannot be computed (e.g. observed mean 0 for KGE). */
  scores: SkillScores | null;
  meanErrorMWe: number;
  rmseMWe: number;
}

/** The band whose elevation range holds z; the nearest band when none does. */
export function bandAt(bands: CatchmentInput['bands'], elevationM: number): number {
  const inside = bands.findIndex((b) => elevationM >= b.lowerM && elevationM < b.upperM);
  if (inside >= 0) return inside;
  const distance = (b: CatchmentInput['bands'][number]) => Math.min(Math.abs(elevationM - b.lowerM), Math.abs(elevationM - b.upperM));
  return bands.reduce((best, b, i) => (distance(b) < distance(bands[best]) ? i : best), 0);
}

/**
 * Simulated point balance at each stake over the reading's period: the change of the snowpack's
 * water (snowfall, refreezing and deposition in; drainage and vapour out) minus the glacier ice lost
 * (melt and vapour) per unit glacier area of the stake's band (glaciological method: accumulation
 * minus ablation at the point, Cogley et al. 2011, Glossary of Glacier Mass Balance [memory]).
 * Wind drift is not modelled; clean and debris-covered ice are mixed as in the band.
 */
export function compareStakes(site: LabSite, observations: readonly StakeObservation[]): StakeComparison {
  const start = site.forcing.start;
  const last = addDays(start, forcingDays(site.forcing) - 1);
  const inside = observations.filter((o) => o.from >= start && o.to <= last && o.from <= o.to);
  if (inside.length === 0) return { readings: [], outsideRecord: observations.length, scores: null, meanErrorMWe: 0, rmseMWe: 0 };
  const to = inside.reduce((a, o) => (o.to > a ? o.to : a), inside[0].to);
  const r = simulate(catchmentInput(site, { from: start, to }));
  const { sweMm, iceMeltMm, debrisIceMeltMm, iceVapourLossMm } = r.bandDay;
  const readings = inside.map((o) => {
    const b = bandAt(site.catchment.bands, o.elevationM);
    const glacier = site.catchment.bands[b].glacierFraction;
    const first = daysBetween(start, o.from);
    const last = daysBetween(start, o.to);
    const before = first > 0 ? sweMm[b * r.dayCount + first - 1] : r.bandTotals.sweStartMm[b];
    let iceLost = 0;
    for (let d = first; d <= last; d++) {
      const i = b * r.dayCount + d;
      iceLost += iceMeltMm[i] + debrisIceMeltMm[i] + iceVapourLossMm[i];
    }
    const mm = sweMm[b * r.dayCount + last] - before - (glacier > 0 ? iceLost / glacier : 0);
    return { ...o, bandIndex: b, simulatedMWe: mm / 1000 };
  });
  const errors = readings.map((x) => x.simulatedMWe - x.balanceMWe);
  return {
    readings,
    outsideRecord: observations.length - inside.length,
    scores: scoresOrNull(readings.map((x) => x.balanceMWe), readings.map((x) => x.simulatedMWe)),
    meanErrorMWe: errors.reduce((s, e) => s + e, 0) / errors.length,
    rmseMWe: Math.sqrt(errors.reduce((s, e) => s + e * e, 0) / errors.length),
  };
}

function scoresOrNull(observed: number[], simulated: number[]): SkillScores | null {
  try {
    return skillScores(observed, simulated);
  } catch {
    return null;
  }
}
