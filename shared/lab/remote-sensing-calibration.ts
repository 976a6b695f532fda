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
 * Automatic calibration against the geodetic balance: the same search, minimising the misfit of
 * the glacier-wide balance in units of its uncertainty, ((s − o)/σ)² with σ at least 0.05 m w.e.
 * per year. Glacier-wide, not band by band: a band's elevation change is its surface balance plus
 * the ice flow into or out of it (emergence below the equilibrium line, submergence above it;
 * dh/dt = ḃ/ρ + w, Cuffey & Paterson 2010, ch. 8), which the engine does not model; the flow sums
 * to zero over the glacier, so the glacier-wide balance is the comparison mass conservation allows
 * (as regional calibrations to geodetic balances do, e.g. Rounce et al. 2020).
 */
export function calibrateToGeodetic(site: LabSite, observed: readonly GeodeticObservation[], options: Options) {
  const misfit = (candidate: LabSite) => {
    const { observedMwePerYear, simulatedMwePerYear, sigmaMwePerYear } = compareGeodetic(candidate, observed).glacierWide;
    return -(((simulatedMwePerYear - observedMwePerYear) / Math.max(0.05, sigmaMwePerYear)) ** 2);
  };
  const found = searchSet(site, misfit, options);
  return { target: 'geodetic' as const, ...found, start: compareGeodetic(siteWith(site, options.start), observed), result: compareGeodetic(siteWith(site, found.set), observed) };
}
