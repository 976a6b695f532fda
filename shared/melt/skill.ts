/**
 * Skill scores for simulated against observed series. Both series must have the same length
 * (≥ 2) and contain only finite numbers; the observed series must vary. Violations throw a
 * RangeError instead of returning NaN.
 */

function checkSeries(observed: ArrayLike<number>, simulated: ArrayLike<number>, fn: string): void {
  if (observed.length !== simulated.length) throw new RangeError(`${fn}: observed has ${observed.length} values, simulated ${simulated.length}`);
  if (observed.length < 2) throw new RangeError(`${fn}: at least two values are needed`);
  for (let i = 0; i < observed.length; i++) {
    if (!Number.isFinite(observed[i])) throw new RangeError(`${fn}: observed[${i}] is not a finite number`);
    if (!Number.isFinite(simulated[i])) throw new RangeError(`${fn}: simulated[${i}] is not a finite number`);
  }
}

function mean(x: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < x.length; i++) s += x[i];
  return s / x.length;
}

/**
 * Nash–Sutcliffe efficiency (Nash & Sutcliffe 1970): 1 − Σ(o − s)² / Σ(o − ō)².
 *
 * @example nse([1, 2, 3], [2, 3, 4]) // −0.5
 */
export function nse(observed: ArrayLike<number>, simulated: ArrayLike<number>): number {
  checkSeries(observed, simulated, 'nse');
  const mo = mean(observed);
  let err = 0;
  let varO = 0;
  for (let i = 0; i < observed.length; i++) {
    err += (observed[i] - simulated[i]) ** 2;
    varO += (observed[i] - mo) ** 2;
  }
  if (varO === 0) throw new RangeError('nse: the observed series does not vary');
  return 1 - err / varO;
}

/** The three parts of the Kling–Gupta efficiency (Gupta et al. 2009, J. Hydrol. 377:80). */
export interface KgeParts {
  /** Pearson correlation; 0 for a constant simulation (Knoben et al. 2019 convention). */
  r: number;
  /** Variability ratio σs/σo (population standard deviations, as Gupta et al. 2009). */
  alpha: number;
  /** Bias ratio μs/μo. */
  beta: number;
}

/**
 * r, α = σs/σo and β = μs/μo of the Kling–Gupta efficiency (Gupta et al. 2009, J. Hydrol. 377:80).
 * A constant simulation has r = 0 by convention (Knoben et al. 2019, HESS 23:4323). The observed
 * series must vary and its mean must not be 0.
 *
 * @example kgeParts([1, 2, 3], [2, 3, 4]) // { r: 1, alpha: 1, beta: 1.5 }
 */
export function kgeParts(observed: ArrayLike<number>, simulated: ArrayLike<number>): KgeParts {
  checkSeries(observed, simulated, 'kge');
  const mo = mean(observed);
  const ms = mean(simulated);
  let cov = 0;
  let varO = 0;
  let varS = 0;
  for (let i = 0; i < observed.length; i++) {
    cov += (observed[i] - mo) * (simulated[i] - ms);
    varO += (observed[i] - mo) ** 2;
    varS += (simulated[i] - ms) ** 2;
  }
  if (varO === 0) throw new RangeError('kge: the observed series does not vary');
  if (mo === 0) throw new RangeError('kge: the observed mean is 0, so the bias ratio is undefined');
  return { r: varS === 0 ? 0 : cov / Math.sqrt(varO * varS), alpha: Math.sqrt(varS / varO), beta: ms / mo };
}

/**
 * Kling–Gupta efficiency (Gupta et al. 2009, J. Hydrol. 377:80):
 * 1 − √((r − 1)² + (α − 1)² + (β − 1)²), from `kgeParts`.
 * The mean-flow predictor scores 1 − √2 (Knoben et al. 2019, HESS 23:4323).
 *
 * @example kge([1, 2, 3], [2, 3, 4]) // 0.5
 */
export function kge(observed: ArrayLike<number>, simulated: ArrayLike<number>): number {
  const { r, alpha, beta } = kgeParts(observed, simulated);
  return 1 - Math.sqrt((r - 1) ** 2 + (alpha - 1) ** 2 + (beta - 1) ** 2);
}
