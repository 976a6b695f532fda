import { invert } from './small-matrix';

/**
 * Bounded Levenberg–Marquardt for a few parameters and residuals (Levenberg 1944, Q. Appl. Math.
 * 2:164; Marquardt 1963, SIAM J. Appl. Math. 11:431): the step solves
 * (JᵀJ + λ diag JᵀJ) δ = −Jᵀr, λ shrinks after a better step and grows after a worse one (÷3 / ×4,
 * common practice). Works in the unit box of the bounds; steps are clamped onto them. Forward
 * differences for J, so each iteration costs one evaluation per parameter plus the trial step —
 * meant for costly models with 1–4 parameters.
 */

export interface BoundedProblem {
  /** Residuals to drive to zero (already divided by their uncertainties). */
  residuals: (x: readonly number[]) => number[];
  lower: readonly number[];
  upper: readonly number[];
  start: readonly number[];
  maxEvaluations?: number;
  /** Forward-difference step as a share of each parameter's range; default 10⁻⁴. Larger for models that are smooth only at a coarser scale. */
  differenceStep?: number;
}

export interface BoundedSolution {
  x: number[];
  residuals: number[];
  /** ½ Σ r². */
  cost: number;
  evaluations: number;
  /** True when the last steps stopped improving the cost (rather than running out of evaluations). */
  converged: boolean;
  /** Per parameter: -1 at the lower bound, 1 at the upper, 0 inside. */
  atBound: number[];
}

const DIFFERENCE_STEP = 1e-4;

const clamp01 = (v: number) => (v < 0 ? 0 : v > 1 ? 1 : v);
const halfSquares = (r: readonly number[]) => 0.5 * r.reduce((s, v) => s + v * v, 0);

/**
 * @example solveBounded({ residuals: ([x]) => [x - 2], lower: [0], upper: [5], start: [1] }).x // ≈ [2]
 */
export function solveBounded(problem: BoundedProblem): BoundedSolution {
  const { lower, upper, start, maxEvaluations = 80, differenceStep = DIFFERENCE_STEP } = problem;
  const n = start.length;
  const span = lower.map((lo, i) => upper[i] - lo);
  if (span.some((s) => !(s > 0))) throw new RangeError('solveBounded: every upper bound must exceed its lower bound');
  const toX = (u: readonly number[]) => u.map((v, i) => lower[i] + clamp01(v) * span[i]);
  let evaluations = 0;
  const evaluate = (u: readonly number[]) => {
    evaluations++;
    const r = problem.residuals(toX(u));
    if (r.some((v) => !Number.isFinite(v))) throw new RangeError('solveBounded: the model returned a value that is not a number');
    return r;
  };

  let u = start.map((v, i) => clamp01((v - lower[i]) / span[i]));
  let r = evaluate(u);
  let cost = halfSquares(r);
  let lambda = 1e-3;
  let converged = false;
  while (evaluations + n + 1 <= maxEvaluations && cost > 1e-24) {
    const jacobian = r.map(() => new Array<number>(n).fill(0));
    for (let j = 0; j < n; j++) {
      const h = u[j] + differenceStep <= 1 ? differenceStep : -differenceStep;
      const shifted = [...u];
      shifted[j] += h;
      const rj = evaluate(shifted);
      for (let k = 0; k < r.length; k++) jacobian[k][j] = (rj[k] - r[k]) / h;
    }
    const jtj = Array.from({ length: n }, (_, a) => Array.from({ length: n }, (_, b) => jacobian.reduce((s, row) => s + row[a] * row[b], 0)));
    const jtr = Array.from({ length: n }, (_, a) => jacobian.reduce((s, row, k) => s + row[a] * r[k], 0));
    // A parameter the residuals do not respond to still gets a damping term, scaled to the others.
    const floor = 1e-9 * Math.max(1e-300, ...jtj.map((row, a) => row[a]));
    let improved = false;
    let stalled = false;
    while (evaluations < maxEvaluations && lambda <= 1e12) {
      const damped = jtj.map((row, a) => row.map((v, b) => (a === b ? v + lambda * Math.max(v, floor) : v)));
      const inverse = invert(damped);
      if (!inverse) { lambda *= 4; continue; }
      const step = inverse.map((row) => -row.reduce((s, v, b) => s + v * jtr[b], 0));
      const trial = u.map((v, i) => clamp01(v + step[i]));
      const moved = Math.max(...trial.map((v, i) => Math.abs(v - u[i])));
      if (moved < 1e-10) { stalled = true; break; }
      const rTrial = evaluate(trial);
      const costTrial = halfSquares(rTrial);
      if (costTrial < cost) {
        const gain = cost - costTrial;
        u = trial;
        r = rTrial;
        cost = costTrial;
        lambda = Math.max(lambda / 3, 1e-9);
        // Each evaluation is an engine run: stop once a step gains less than a millionth of the cost
        // or moves less than a millionth of the box, far inside what the observations can resolve.
        improved = gain > 1e-6 * Math.max(cost, 1e-12) && moved > 1e-6;
        stalled = !improved;
        break;
      }
      lambda *= 4;
    }
    if (lambda > 1e12) stalled = true;
    if (stalled) converged = true;
    if (!improved) break;
  }
  if (cost <= 1e-24) converged = true;
  return { x: toX(u), residuals: r, cost, evaluations, converged, atBound: u.map((v) => (v <= 1e-9 ? -1 : v >= 1 - 1e-9 ? 1 : 0)) };
}
