import { describe, expect, it } from 'vitest';
import { seededRandom } from '../analysis/random';
import { planWindDrift, windDrift } from './wind-drift';

const band = (areaKm2: number, i: number) => ({ lowerM: 2000 + 200 * i, upperM: 2200 + 200 * i, areaKm2 });

describe('wind drift with mass-conserving accumulation factors', () => {
  it('hand-worked: equal bands, 10 mm each, factors 0.5 and 1.5 → −5 and +5 mm', () => {
    const plan = planWindDrift([band(1, 0), band(1, 1)], [0.5, 1.5]);
    const swe = Float64Array.from([10, 10]);
    const net = new Float64Array(2);
    windDrift(plan, [10, 10], swe, net);
    expect(Array.from(net)).toEqual([expect.closeTo(-5, 12), expect.closeTo(5, 12)]);
    expect(Array.from(swe)).toEqual([expect.closeTo(5, 12), expect.closeTo(15, 12)]);
  });

  it('hand-worked with unequal areas: k = 40/50, so +6 mm over 1 km² and −2 mm over 3 km²', () => {
    const plan = planWindDrift([band(1, 0), band(3, 1)], [2, 1]);
    const swe = Float64Array.from([10, 10]);
    const net = new Float64Array(2);
    windDrift(plan, [10, 10], swe, net);
    expect(net[0]).toBeCloseTo(6, 12);
    expect(net[1]).toBeCloseTo(-2, 12);
  });

  it('moves nothing with equal factors or without snowfall', () => {
    const plan = planWindDrift([band(1, 0), band(2, 1)], [1.7, 1.7]);
    const swe = Float64Array.from([10, 20]);
    const net = new Float64Array(2);
    windDrift(plan, [4, 6], swe, net);
    expect(Array.from(net)).toEqual([expect.closeTo(0, 12), expect.closeTo(0, 12)]);
    windDrift(planWindDrift([band(1, 0), band(2, 1)], [0.2, 2]), [0, 0], swe, net);
    expect(Array.from(net)).toEqual([0, 0]);
  });

  it("conserves mass to 1e-9 and never takes more than the day's snowfall, over 3000 random days", () => {
    const random = seededRandom(11);
    const bands = Array.from({ length: 10 }, (_, i) => band(0.3 + 4 * random(), i));
    const plan = planWindDrift(bands, bands.map(() => 3 * random()));
    const swe = new Float64Array(10);
    const net = new Float64Array(10);
    const snowfall = new Float64Array(10);
    let worstImbalance = 0;
    let worstOvertake = 0;
    for (let day = 0; day < 3000; day++) {
      for (let b = 0; b < 10; b++) {
        snowfall[b] = random() < 0.4 ? 30 * random() : 0;
        swe[b] += snowfall[b];
      }
      const before = swe.reduce((s, v, i) => s + v * bands[i].areaKm2, 0);
      windDrift(plan, snowfall, swe, net);
      const after = swe.reduce((s, v, i) => s + v * bands[i].areaKm2, 0);
      worstImbalance = Math.max(worstImbalance, Math.abs(after - before) / Math.max(1, before));
      for (let b = 0; b < 10; b++) worstOvertake = Math.max(worstOvertake, -net[b] - snowfall[b]);
    }
    expect(worstImbalance).toBeLessThanOrEqual(1e-9);
    expect(worstOvertake).toBeLessThanOrEqual(1e-12);
  });

  it('refuses factors outside 0 … 3 or of the wrong count, naming the index', () => {
    expect(() => planWindDrift([band(1, 0)], [4])).toThrow('windFactors[0]: the accumulation factor 4 is outside 0 … 3.');
    expect(() => planWindDrift([band(1, 0), band(1, 1)], [1])).toThrow(/windFactors: 2 factors are needed/);
  });
});
