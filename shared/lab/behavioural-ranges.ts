import { latinHypercube } from '../analysis/latin-hypercube';
import { seededRandom } from '../analysis/random';
import { keySpec, valueOf, withValues, type CalibrationKey, type CalibrationSet } from './calibration-set';
import { fitQuadratic, projectedHalfWidths } from './quadratic-fit';

/**
 * How well the observations pin the calibrated parameters down. Around the best set, the score
 * (KGE) is sampled on a Latin hypercube (McKay et al. 1979) ± `spread` of each parameter's range
 * and its squared distance from a perfect score, (1 − KGE)² = (r − 1)² + (α − 1)² + (β − 1)²
 * (Gupta et al. 2009), is fitted by a quadratic surface (KGE itself is cone-shaped at its peak); the sets that score within `tolerance` of the best form an
 * ellipsoid (the "behavioural" sets of GLUE, Beven & Binley 1992, Hydrol. Process. 6:279, under a
 * local quadratic approximation), and each parameter's range is that ellipsoid's extent along its
 * axis. Parameters that trade off against each other (a colder lapse rate and more sunshine, say)
 * show as wide ranges together. Two probes along each parameter first size the box to its
 * sensitivity. If the fitted surface has no maximum (a flat or saddle-shaped score), the range
 * falls back to the behavioural samples' extent and is marked open.
 */
export interface ParameterRange {
  key: CalibrationKey;
  best: number;
  low: number;
  high: number;
  /** True when the observations do not bound the parameter on that side within the sampled region. */
  open: boolean;
}

export interface BehaviouralRanges {
  ranges: ParameterRange[];
  tolerance: number;
  sampled: number;
}

export interface BehaviouralOptions {
  samples?: number;
  spread?: number;
  tolerance?: number;
  seed?: number;
  signal?: AbortSignal;
  onProgress?: (done: number, total: number) => void;
}

export function behaviouralRanges(
  score: (set: CalibrationSet) => number, best: CalibrationSet, keys: readonly CalibrationKey[], bestScore: number, options: BehaviouralOptions = {},
): BehaviouralRanges {
  const n = keys.length;
  const { samples = 6 * (n + 1) * (n + 2) / 2, spread = 0.05, tolerance = 0.03, seed = 1 } = options;
  const specs = keys.map(keySpec);
  const centre = keys.map((k) => valueOf(best, k));
  const distance = 1 - bestScore;
  const goal = (distance + tolerance) ** 2 - distance ** 2;
  const total = 2 * n + samples;
  let done = 0;
  const misfit = (values: number[]): number => {
    if (options.signal?.aborted) throw options.signal.reason;
    const clamped = values.map((v, j) => Math.min(specs[j].max, Math.max(specs[j].min, v)));
    const value = score(withValues(best, keys, clamped));
    options.onProgress?.(++done, total);
    return Number.isFinite(value) ? -((1 - value) ** 2) : Number.NaN;
  };
  // Probe each axis to size the sampled box to the parameter's sensitivity: about 1.5 times the
  // distance at which, alone, it would leave the behavioural region.
  const centreMisfit = -(distance ** 2);
  const half = specs.map((spec, j) => {
    const step = spread * (spec.max - spec.min);
    const up = misfit(centre.map((v, k) => (k === j ? v + step : v)));
    const down = misfit(centre.map((v, k) => (k === j ? v - step : v)));
    const curvature = (up - 2 * centreMisfit + down) / (step * step);
    const width = curvature < 0 ? Math.sqrt((2 * goal) / -curvature) : 2 * step;
    return Math.min(1.5 * width, spec.max - spec.min);
  });
  const points: number[][] = [new Array<number>(n).fill(0)];
  const misfits: number[] = [centreMisfit];
  latinHypercube(samples, n, seededRandom(seed)).forEach((u) => {
    const x = u.map((v) => 2 * v - 1);
    const m = misfit(x.map((v, j) => centre[j] + v * half[j]));
    if (Number.isNaN(m)) return;
    points.push(x);
    misfits.push(m);
  });
  const widths = projectedHalfWidths(fitQuadratic(points, misfits), goal);
  const ranges = keys.map((key, j): ParameterRange => {
    const spec = specs[j];
    if (widths) {
      const w = widths[j] * half[j];
      return { key, best: centre[j], low: Math.max(spec.min, centre[j] - w), high: Math.min(spec.max, centre[j] + w), open: false };
    }
    const kept = points.filter((_, i) => misfits[i] >= -((distance + tolerance) ** 2)).map((p) => centre[j] + p[j] * half[j]);
    return { key, best: centre[j], low: Math.min(centre[j], ...kept), high: Math.max(centre[j], ...kept), open: true };
  });
  return { ranges, tolerance, sampled: points.length + 2 * n };
}
