import { refuse } from './errors';

/** A straight line y = intercept + slope · x fitted by ordinary least squares. */
export interface LineFit {
  slope: number;
  intercept: number;
  /** Standard error of the slope, s / √Σ(x − x̄)²; null with two points (no degrees of freedom left). */
  slopeStandardError: number | null;
  /** Standard error of the intercept, s √(1/n + x̄²/Σ(x − x̄)²); null with two points. */
  interceptStandardError: number | null;
  /** Coefficient of determination 1 − SSR/SST (1 when all y are equal and fitted exactly). */
  r2: number;
  n: number;
  /** Residual standard deviation s = √(SSR/(n − 2)); null with two points. */
  residualStandardDeviation: number | null;
}

/**
 * Ordinary least-squares line through (x, y) pairs: the textbook closed form (e.g. Draper & Smith,
 * Applied Regression Analysis, ch. 1 — common practice). Checked in tests against Anscombe's (1973)
 * data set I, whose published fit is y = 3.00 + 0.500 x, r² = 0.67.
 *
 * @param x abscissae (e.g. station elevations, m)
 * @param y ordinates (e.g. station temperatures, °C)
 * @param path where the points came from, for messages (e.g. `stations`)
 * @throws HydrologyInputError with fewer than two points, unequal lengths, non-finite values or all x equal
 * @example fitLine([1000, 2000, 3000], [10, 4, -2], 'stations').slope // -0.006 (°C per m)
 */
export function fitLine(x: readonly number[], y: readonly number[], path: string): LineFit {
  const n = x.length;
  if (y.length !== n) refuse(path, `has ${n} positions but ${y.length} values.`);
  if (n < 2) refuse(path, `a straight line has two parameters, so it needs at least two points; there ${n === 1 ? 'is one' : 'are none'}.`);
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(x[i]) || !Number.isFinite(y[i])) refuse(`${path}[${i}]`, `is not a number (${x[i]}, ${y[i]}).`);
  }
  const xMean = x.reduce((s, v) => s + v, 0) / n;
  const yMean = y.reduce((s, v) => s + v, 0) / n;
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    sxx += (x[i] - xMean) ** 2;
    sxy += (x[i] - xMean) * (y[i] - yMean);
    syy += (y[i] - yMean) ** 2;
  }
  if (!(sxx > 1e-12 * Math.max(1, xMean * xMean))) refuse(path, 'all points lie at the same position, so no gradient can be fitted.');
  const slope = sxy / sxx;
  const intercept = yMean - slope * xMean;
  let ssr = 0;
  for (let i = 0; i < n; i++) ssr += (y[i] - intercept - slope * x[i]) ** 2;
  const s = n > 2 ? Math.sqrt(ssr / (n - 2)) : null;
  return {
    slope,
    intercept,
    slopeStandardError: s === null ? null : s / Math.sqrt(sxx),
    interceptStandardError: s === null ? null : s * Math.sqrt(1 / n + (xMean * xMean) / sxx),
    r2: syy > 0 ? 1 - ssr / syy : 1,
    n,
    residualStandardDeviation: s,
  };
}
