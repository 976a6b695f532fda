import { describe, expect, it } from 'vitest';
import { maximise } from './nelder-mead';

// Rosenbrock (1960) turned upside down: maximum 0 at (1, 1).
const rosenbrock = ([x, y]: number[]) => -((1 - x) ** 2 + 100 * (y - x * x) ** 2);

describe('bounded Nelder–Mead search', () => {
  it('finds the maximum of a smooth bowl inside the bounds', () => {
    const r = maximise(([x, y, z]) => -((x - 0.3) ** 2 + (y + 2) ** 2 + (z - 7) ** 2), { lower: [-1, -5, 0], upper: [1, 5, 10], start: [0, 0, 5], maxEvaluations: 400, tolerance: 1e-12 });
    expect(r.best[0]).toBeCloseTo(0.3, 3);
    expect(r.best[1]).toBeCloseTo(-2, 3);
    expect(r.best[2]).toBeCloseTo(7, 3);
    expect(r.converged).toBe(true);
  });
  it('finds the Rosenbrock maximum at (1, 1)', () => {
    const r = maximise(rosenbrock, { lower: [-2, -2], upper: [2, 3], start: [-1, 1], maxEvaluations: 1000, tolerance: 1e-14 });
    expect(r.best[0]).toBeCloseTo(1, 2);
    expect(r.best[1]).toBeCloseTo(1, 2);
  });
  it('stays inside the bounds when the maximum lies outside them', () => {
    const seen: number[][] = [];
    const r = maximise(([x, y]) => { seen.push([x, y]); return x + y; }, { lower: [0, 0], upper: [1, 2], start: [0.5, 0.5], maxEvaluations: 200 });
    expect(r.best[0]).toBeCloseTo(1, 6);
    expect(r.best[1]).toBeCloseTo(2, 6);
    for (const [x, y] of seen) {
      expect(x).toBeGreaterThanOrEqual(0);
      expect(x).toBeLessThanOrEqual(1);
      expect(y).toBeGreaterThanOrEqual(0);
      expect(y).toBeLessThanOrEqual(2);
    }
  });
  it('gives the same answer for the same seed and respects the evaluation budget', () => {
    const options = { lower: [-2, -2], upper: [2, 3], start: [-1, 1], maxEvaluations: 60, seed: 42 };
    const a = maximise(rosenbrock, options);
    const b = maximise(rosenbrock, options);
    expect(a).toEqual(b);
    expect(a.evaluations).toBeLessThanOrEqual(60 + 2);
  });
  it('reports progress with the best value so far, never falling', () => {
    const values: number[] = [];
    maximise(rosenbrock, { lower: [-2, -2], upper: [2, 3], start: [0, 0], maxEvaluations: 50, onProgress: (p) => values.push(p.bestValue) });
    expect(values.length).toBeGreaterThan(10);
    for (let i = 1; i < values.length; i++) expect(values[i]).toBeGreaterThanOrEqual(values[i - 1]);
  });
  it('stops with the abort reason once the signal is aborted', () => {
    const controller = new AbortController();
    let calls = 0;
    const run = () => maximise(() => { if (++calls === 5) controller.abort(new Error('cancelled by the user')); return calls; }, { lower: [0], upper: [1], start: [0.5], signal: controller.signal });
    expect(run).toThrow('cancelled by the user');
    expect(calls).toBe(5);
  });
  it('refuses empty bounds', () => {
    expect(() => maximise(() => 0, { lower: [1], upper: [1], start: [1] })).toThrow(/bound 0 is empty/);
  });
});
