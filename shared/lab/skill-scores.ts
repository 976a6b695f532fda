import { kge, nse } from '../melt/index';

/** The three parts of the Kling–Gupta efficiency (Gupta et al. 2009, J. Hydrol. 377:80). */
export interface KgeParts {
  /** Pearson correlation; 0 for a constant simulation (Knoben et al. 2019 convention). */
  r: number;
  /** Variability ratio σs/σo. */
  alpha: number;
  /** Bias ratio μs/μo. */
  beta: number;
}

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

/** r, α and β of the KGE, population standard deviations (as Gupta et al. 2009). */
export function kgeParts(observed: readonly number[], simulated: readonly number[]): KgeParts {
  const mo = mean(observed);
  const ms = mean(simulated);
  let cov = 0;
  let vo = 0;
  let vs = 0;
  for (let i = 0; i < observed.length; i++) {
    cov += (observed[i] - mo) * (simulated[i] - ms);
    vo += (observed[i] - mo) ** 2;
    vs += (simulated[i] - ms) ** 2;
  }
  return { r: vs === 0 ? 0 : cov / Math.sqrt(vo * vs), alpha: Math.sqrt(vs / vo), beta: ms / mo };
}

/**
 * NSE and KGE from the engine (which refuses series of unequal length, non-finite values, a
 * constant or zero-mean observed series), with the KGE parts and the percent bias beside them.
 */
export function skillScores(observed: readonly number[], simulated: readonly number[]): SkillScores {
  const scoreKge = kge(observed, simulated);
  const meanObserved = mean(observed);
  const meanSimulated = mean(simulated);
  return {
    count: observed.length,
    nse: nse(observed, simulated),
    kge: scoreKge,
    ...kgeParts(observed, simulated),
    biasPercent: (100 * (meanSimulated - meanObserved)) / meanObserved,
    meanObserved,
    meanSimulated,
  };
}
