import { seededRandom } from '../analysis/random';
/**
 * Bounded Nelder–Mead search for a maximum (Nelder & Mead 1965, Comput. J. 7:308; coefficients
 * reflection 1, expansion 2, contraction ½, shrink ½ as in Lagarias et al. 1998, SIAM J. Optim.
 * 9:112). Works in the unit cube of the scaled bounds; points outside are clamped onto them.
 * Deterministic for a given seed; the seed only sets the initial simplex step sizes.
 */

export interface SearchProgress {
  evaluations: number;
  maxEvaluations: number;
  bestValue: number;
  best: number[];
}

export interface SearchOptions {
  lower: readonly number[];
  upper: readonly number[];
  start: readonly number[];
  maxEvaluations?: number;
  /** Stop when the simplex values differ by less than this. */
  tolerance?: number;
  seed?: number;
  /** Checked before every evaluation; an aborted search throws the signal's reason. */
  signal?: AbortSignal;
  onProgress?: (progress: SearchProgress) => void;
}

export interface SearchResult {
  best: number[];
  bestValue: number;
  evaluations: number;
  converged: boolean;
}

const clamp01 = (v: number) => (v < 0 ? 0 : v > 1 ? 1 : v);

export function maximise(objective: (x: number[]) => number, options: SearchOptions): SearchResult {
  const { lower, upper, start, maxEvaluations = 100, tolerance = 1e-4, seed = 1, signal, onProgress } = options;
  const n = start.length;
  if (n < 1 || lower.length !== n || upper.length !== n) throw new RangeError('maximise: start, lower and upper need the same, non-zero length');
  for (let i = 0; i < n; i++) {
    if (!(upper[i] > lower[i])) throw new RangeError(`maximise: bound ${i} is empty (${lower[i]} … ${upper[i]})`);
  }
  const toReal = (u: number[]) => u.map((v, i) => lower[i] + clamp01(v) * (upper[i] - lower[i]));
  let evaluations = 0;
  let best = { u: [] as number[], value: -Infinity };
  const evaluate = (u: number[]): { u: number[]; value: number } => {
    signal?.throwIfAborted();
    const clamped = u.map(clamp01);
    const raw = objective(toReal(clamped));
    const value = Number.isFinite(raw) ? raw : -Infinity;
    evaluations++;
    if (value > best.value) best = { u: clamped, value };
    onProgress?.({ evaluations, maxEvaluations, bestValue: best.value, best: toReal(best.u) });
    return { u: clamped, value };
  };

  const random = seededRandom(seed);
  const origin = start.map((v, i) => clamp01((v - lower[i]) / (upper[i] - lower[i])));
  let simplex = [evaluate(origin)];
  for (let i = 0; i < n; i++) {
    const step = 0.15 + 0.1 * random();
    const u = [...origin];
    u[i] = u[i] + step <= 1 ? u[i] + step : u[i] - step;
    simplex.push(evaluate(u));
  }

  const combine = (a: number[], b: number[], t: number) => a.map((v, i) => v + t * (b[i] - v));
  let converged = false;
  while (evaluations < maxEvaluations) {
    simplex.sort((a, b) => b.value - a.value);
    if (simplex[0].value - simplex[n].value < tolerance && simplex[0].value > -Infinity) {
      converged = true;
      break;
    }
    const worst = simplex[n];
    const centroid = origin.map((_, i) => simplex.slice(0, n).reduce((s, p) => s + p.u[i], 0) / n);
    const reflected = evaluate(combine(centroid, worst.u, -1));
    if (reflected.value > simplex[0].value) {
      const expanded = evaluate(combine(centroid, worst.u, -2));
      simplex[n] = expanded.value > reflected.value ? expanded : reflected;
    } else if (reflected.value > simplex[n - 1].value) {
      simplex[n] = reflected;
    } else {
      const outside = reflected.value > worst.value;
      const contracted = evaluate(combine(centroid, outside ? reflected.u : worst.u, 0.5));
      if (contracted.value > Math.max(reflected.value, worst.value)) {
        simplex[n] = contracted;
      } else {
        simplex = [simplex[0], ...simplex.slice(1).map((p) => evaluate(combine(simplex[0].u, p.u, 0.5)))];
      }
    }
  }
  return { best: toReal(best.u), bestValue: best.value, evaluations, converged };
}
