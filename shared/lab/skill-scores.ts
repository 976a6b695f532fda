import { kge, nse } from '../melt/skill';
import { kgeParts, type KgeParts } from '../melt/skill';

export interface SkillScores extends KgeParts {
  count: number;
  nse: number;
  kge: number;
  /** Percent bias 100·(Σs − Σo)/Σo. */
  biasPercent: number;
  meanObserved: number;
  meanSimulated: number;
}

function mean(x: readonly number[]): number {
  return x.reduce((s, v) => s + v, 0) / x.length;
}

/**
 * NSE and KGE from the engine (which refuses series of unequal length, non-finite values, a
 * constant or zero-mean observed series), with the KGE parts and the percent bias beside them.
 */
export function skillScores(observed: readonly number[], simulated: readonly number[]): SkillScores {
  const meanObserved = mean(observed);
  const meanSimulated = mean(simulated);
  return {
    count: observed.length,
    nse: nse(observed, simulated),
    kge: kge(observed, simulated),
    ...kgeParts(observed, simulated),
    biasPercent: (100 * (meanSimulated - meanObserved)) / meanObserved,
    meanObserved,
    meanSimulated,
  };
}

/** The skill scores, or null when they cannot be computed (fewer than two values, a constant or zero-mean observed series). */
export function skillScoresOrNull(observed: readonly number[], simulated: readonly number[]): SkillScores | null {
  try {
    return observed.length >= 2 ? skillScores(observed, simulated) : null;
  } catch {
    return null;
  }
}
