import { searchSet, type CalibrateOptions } from './calibrate';
import { siteWith } from './calibration-set';
import { compareGeodetic, type GeodeticObservation } from './geodetic-skill';
import type { LabSite } from './site';
import { compareSnowCover, type SnowCoverObservation } from './snow-cover-skill';

type Options = Omit<CalibrateOptions, 'period'>;

/**
 * Automatic calibration against snow-cover maps: the bounded search of the discharge calibration,
 * maximising the KGE of simulated against mapped snow-covered fraction over all bands and dates.
 */
export function calibrateToSnowCover(site: LabSite, observed: readonly SnowCoverObservation[], options: Options) {
  const kgeOf = (candidate: LabSite) => {
    const scores = compareSnowCover(candidate, observed).scores;
    if (!scores) throw new RangeError('snow-cover skill cannot be computed');
    return scores.kge;
  };
  const found = searchSet(site, kgeOf, options);
  return { target: 'snowCover' as const, ...found, start: compareSnowCover(siteWith(site, options.start), observed), result: compareSnowCover(siteWith(site, found.set), observed) };
}

/**
 * Automatic calibration against the geodetic balance profile: the same search, minimising the mean
 * squared error weighted by each band's uncertainty, Σ((s − o)/σ)²/n (a χ² misfit, common practice
 * when observations carry their errors); σ is kept at least 0.05 m w.e. per year.
 */
export function calibrateToGeodetic(site: LabSite, observed: readonly GeodeticObservation[], options: Options) {
  const misfit = (candidate: LabSite) => {
    const { rows } = compareGeodetic(candidate, observed);
    return -rows.reduce((s, r) => s + ((r.simulatedMwePerYear - r.balanceMwePerYear) / Math.max(0.05, r.sigmaMwePerYear)) ** 2, 0) / Math.max(1, rows.length);
  };
  const found = searchSet(site, misfit, options);
  return { target: 'geodetic' as const, ...found, start: compareGeodetic(siteWith(site, options.start), observed), result: compareGeodetic(siteWith(site, found.set), observed) };
}
