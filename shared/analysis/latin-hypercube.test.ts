import { describe, expect, it } from 'vitest';
import { latinHypercube } from './latin-hypercube';
import { seededRandom } from './random';
import { ENSEMBLE_PARAMETERS, ensembleParameterSets } from './ensemble-parameters';
import { PARAMETER_SPECS } from '../melt/parameters';

describe('Latin hypercube sampling (McKay et al. 1979)', () => {
  it('puts exactly one sample in every stratum of every dimension', () => {
    const n = 50;
    const points = latinHypercube(n, 7, seededRandom(42));
    expect(points).toHaveLength(n);
    for (let j = 0; j < 7; j++) {
      const strata = points.map((p) => Math.floor(p[j] * n)).sort((a, b) => a - b);
      expect(strata).toEqual(Array.from({ length: n }, (_, i) => i));
    }
  });

  it('is reproducible from its seed and differs between seeds', () => {
    expect(latinHypercube(10, 3, seededRandom(1))).toEqual(latinHypercube(10, 3, seededRandom(1)));
    expect(latinHypercube(10, 3, seededRandom(1))).not.toEqual(latinHypercube(10, 3, seededRandom(2)));
  });

  it('refuses an empty sample', () => {
    expect(() => latinHypercube(0, 3, seededRandom(1))).toThrow(/count must be a positive integer/);
  });

  it('maps samples into each parameter range and keeps other overrides', () => {
    const sets = ensembleParameterSets(20, 3, { rainSnowThresholdC: 0.5 });
    for (const set of sets) {
      expect(set.rainSnowThresholdC).toBe(0.5);
      for (const name of ENSEMBLE_PARAMETERS) {
        expect(set[name]).toBeGreaterThanOrEqual(PARAMETER_SPECS[name].min);
        expect(set[name]).toBeLessThanOrEqual(PARAMETER_SPECS[name].max);
      }
    }
  });
});
