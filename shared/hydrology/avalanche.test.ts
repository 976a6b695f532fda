import { describe, expect, it } from 'vitest';
import { seededRandom } from '../analysis/random';
import { avalanche, DEFAULT_AVALANCHE_PARAMETERS, holdingCapacityMm, planAvalanching, type AvalancheBand } from './avalanche';

const P = DEFAULT_AVALANCHE_PARAMETERS;
const band = (lowerM: number, areaKm2: number, slopeDeg: number): AvalancheBand => ({ lowerM, upperM: lowerM + 300, areaKm2, slopeDeg });

describe('holding capacity (Bernhardt & Schulz 2010 form, SHD = 3178.4 β^−1.998 m [memory])', () => {
  it('30° holds 3178.4·30^−1.998 m of snow, × 250 kg m⁻³ in SWE; steeper holds less; flat holds everything', () => {
    expect(holdingCapacityMm(30, P)).toBeCloseTo(3178.4 * Math.pow(30, -1.998) * 250, 9);
    expect(holdingCapacityMm(30, P)).toBeGreaterThan(holdingCapacityMm(45, P));
    expect(holdingCapacityMm(0, P)).toBe(Infinity);
  });
  it('never less than the minimum depth: near 90° a 0.1 m floor (25 mm w.e.) holds', () => {
    expect(holdingCapacityMm(89.9, P)).toBeCloseTo(3178.4 * Math.pow(89.9, -1.998) * 250, 9);
    expect(holdingCapacityMm(89.9, { ...P, holdingCoefficient: 500, minimumHoldingDepthM: 0.1 })).toBeCloseTo(0.1 * 250, 9);
  });
});

describe('avalanching on bands', () => {
  it('hand-worked cascade: excess slides to the next lower band and on while it exceeds that band too', () => {
    // Given in any order: top (2 km², 50°), middle (1 km², 45°), bottom (4 km², 5°).
    const bands = [band(3000, 1, 45), band(2000, 4, 5), band(4000, 2, 50)];
    const plan = planAvalanching(bands);
    const [hMid, hTop] = [holdingCapacityMm(45, P), holdingCapacityMm(50, P)];
    const swe = Float64Array.from([hMid + 10, 100, hTop + 60]);
    const net = new Float64Array(3);
    const moved = avalanche(plan, swe, net);
    // Top loses 60 mm over 2 km² = 120 mm·km²; the middle gains 120 mm, then passes 130 mm on to the bottom (4 km²): +32.5 mm.
    expect(swe[2]).toBeCloseTo(hTop, 9);
    expect(swe[0]).toBeCloseTo(hMid, 9);
    expect(swe[1]).toBeCloseTo(100 + 130 / 4, 9);
    expect(Array.from(net)).toEqual([expect.closeTo(-10, 9), expect.closeTo(32.5, 9), expect.closeTo(-60, 9)]);
    expect(moved).toBeCloseTo(120 + 130, 9);
  });

  it('the lowest band keeps what reaches it, even above its own capacity', () => {
    const plan = planAvalanching([band(2000, 1, 60)]);
    const swe = Float64Array.from([5000]);
    expect(avalanche(plan, swe, new Float64Array(1))).toBe(0);
    expect(swe[0]).toBe(5000);
  });

  it('conserves mass to 1e-9 and moves snow only downslope, over 3000 random days on 12 bands', () => {
    const random = seededRandom(3);
    const bands = Array.from({ length: 12 }, (_, i) => band(2000 + 300 * i, 0.5 + 5 * random(), 10 + 50 * random()));
    const plan = planAvalanching(bands);
    const swe = new Float64Array(12);
    const net = new Float64Array(12);
    const mass = () => swe.reduce((s, v, i) => s + v * bands[i].areaKm2, 0);
    let worstImbalance = 0;
    let worstUphill = 0;
    let lowestSwe = 0;
    let movingDays = 0;
    for (let day = 0; day < 3000; day++) {
      for (let b = 0; b < 12; b++) swe[b] += random() < 0.3 ? 40 * random() : 0;
      const before = mass();
      if (avalanche(plan, swe, net) > 0) movingDays++;
      worstImbalance = Math.max(worstImbalance, Math.abs(mass() - before) / Math.max(1, before));
      // Going down from the top band, the running sum of volume change can only be ≤ 0: nothing climbs.
      let running = 0;
      for (let b = 11; b >= 0; b--) {
        running += net[b] * bands[b].areaKm2;
        worstUphill = Math.max(worstUphill, running / Math.max(1, before));
      }
      lowestSwe = Math.min(lowestSwe, ...swe);
      if (day % 200 === 0) swe.fill(0);
    }
    expect(movingDays).toBeGreaterThan(100);
    expect(worstImbalance).toBeLessThanOrEqual(1e-9);
    expect(worstUphill).toBeLessThanOrEqual(1e-9);
    expect(lowestSwe).toBeGreaterThanOrEqual(0);
  });

  it('refuses a band without area and a slope outside 0 … 90°, naming the field', () => {
    expect(() => planAvalanching([band(2000, 0, 30)])).toThrow(/bands\[0\].areaKm2/);
    expect(() => planAvalanching([band(2000, 1, 30)], P, [95])).toThrow(/releaseSlopeDeg\[0\]: a slope of 95°/);
    expect(() => planAvalanching([band(2000, 1, 30)], { ...P, snowDensityKgM3: 5 })).toThrow(/avalanche.snowDensityKgM3/);
  });
});
