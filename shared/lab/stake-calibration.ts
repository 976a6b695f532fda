import { searchSet, type CalibrateOptions, type SearchOutcome } from './calibrate';
import { siteWith } from './calibration-set';
import { compareStakes, type StakeComparison, type StakeObservation } from './stake-balance';
import type { LabSite, Period } from './site';

export interface StakeCalibrationOutcome extends SearchOutcome {
  start: StakeComparison;
  result: StakeComparison;
}

/** Readings whose whole period lies inside `period`. */
export function readingsWithin(readings: readonly StakeObservation[], period: Period): StakeObservation[] {
  return readings.filter((r) => r.from >= period.from && r.to <= period.to);
}

/**
 * Automatic calibration against stake balances: the same bounded search, maximising the KGE of
 * simulated against measured point balances of the readings inside the period.
 */
export function calibrateToStakes(site: LabSite, readings: readonly StakeObservation[], options: CalibrateOptions): StakeCalibrationOutcome {
  const inside = readingsWithin(readings, options.period);
  if (inside.length < 2) throw new RangeError(`only ${inside.length} stake reading(s) lie between ${options.period.from} and ${options.period.to}; at least two are needed`);
  const kgeOf = (candidate: LabSite) => {
    const scores = compareStakes(candidate, inside).scores;
    if (!scores) throw new RangeError('stake skill cannot be computed');
    return scores.kge;
  };
  const found = searchSet(site, kgeOf, options);
  return { ...found, start: compareStakes(siteWith(site, options.start), inside), result: compareStakes(siteWith(site, found.set), inside) };
}
