import { describe, expect, it } from 'vitest';
import { fastAtan } from './fast-atan';
import { horizonTangents, horizonWork, profileHorizons } from './horizon';
import type { GridGeometry } from './raster';
import { sunlitFraction, terrainShading, viewFactorTerm } from './sky-view';
import { hornGradient } from './terrain';
import { valueNoise } from './demo/value-noise';

/**
 * Horizons and sky view against cases with known answers (derivations in the comments):
 *   open plain                    horizon 0° everywhere, V = 1 exactly
 *   slope under a level horizon   V = (1 + cos S)/2 (the isotropic tilted-surface view)
 *   V-valley floor, walls at α    horizon atan(tan α |cos φ|) across azimuth φ from the cross-valley
 *                                 direction; V = (1/2π)∫cos²h dφ = 1/√(1 + tan²α) = cos α
 *   bowl z = r²/2a, rim at R     from the centre the rim is highest: horizon atan(R/2a), V = cos²h
 *   flat-floored crater centre    horizon atan(D/R) to the rim, V = R²/(R² + D²)
 * Tolerances: horizons 0.5° (0.1° percentile bins; profile samples lie up to half a cell off the
 * cell centres and are interpolated across the rim), V 0.003.
 */
const RAD = Math.PI / 180;

function surface(n: number, cell: number, height: (x: number, y: number) => number): { z: Float32Array; grid: GridGeometry } {
  const grid = { width: n, height: n, x0: 0, y0: n * cell, dx: cell, dy: cell };
  const z = new Float32Array(n * n);
  const mid = (n - 1) / 2;
  for (let r = 0; r < n; r++) for (let c = 0; c < n; c++) z[r * n + c] = height((c - mid) * cell, (mid - r) * cell);
  return { z, grid };
}

function shadeCentre(z: Float32Array, grid: GridGeometry, sectors = 72) {
  const zone = new Int32Array(z.length).fill(-1);
  const centre = Math.floor(grid.height / 2) * grid.width + Math.floor(grid.width / 2);
  zone[centre] = 0;
  const result = terrainShading(z, grid, hornGradient(z, grid), zone, 1, sectors, { curvature: false });
  return { svf: result.skyViewFactor[0], horizon: result.horizonDeg[0] };
}

describe('sky-view factor and horizons on analytic terrain', () => {
  it('an open plain has a level horizon and sees the whole sky', () => {
    const { z, grid } = surface(101, 30, () => 1500);
    const { svf, horizon } = shadeCentre(z, grid, 36);
    expect(svf).toBe(1);
    for (const sector of horizon) for (const h of sector) expect(Math.abs(h)).toBeLessThan(0.1);
  });

  it('a slope under a level horizon sees (1 + cos S)/2 of the sky', () => {
    for (const slope of [10, 30, 60]) {
      const g = Math.tan(slope * RAD);
      let sum = 0;
      for (let k = 0; k < 3600; k++) {
        const plane = g * Math.cos((2 * Math.PI * k) / 3600);
        sum += viewFactorTerm(Math.max(0, plane), plane, g * g);
      }
      expect(sum / 3600).toBeCloseTo((1 + Math.cos(slope * RAD)) / 2, 9);
    }
  });

  it('the floor of a V-valley with 30° walls sees cos 30° of the sky', () => {
    const alpha = 30 * RAD;
    const { z, grid } = surface(201, 10, (x) => Math.abs(x) * Math.tan(alpha));
    const { svf, horizon } = shadeCentre(z, grid);
    expect(Math.abs(svf - Math.cos(alpha))).toBeLessThan(0.003);
    // sector k looks towards k·5°: along the valley (0°, 180°) level, across it (90°, 270°) 30°, at 45° atan(tan 30° cos 45°)
    expect(Math.abs(horizon[0][2])).toBeLessThan(0.2);
    expect(Math.abs(horizon[18][2] - 30)).toBeLessThan(0.2);
    expect(Math.abs(horizon[54][2] - 30)).toBeLessThan(0.2);
    expect(Math.abs(horizon[9][2] - Math.atan(Math.tan(alpha) * Math.cos(45 * RAD)) / RAD)).toBeLessThan(0.2);
  });

  it('the centre of a round bowl sees the sky above its rim: cos² atan(R/2a)', () => {
    const a = 1000;
    const rim = 700;
    const { z, grid } = surface(201, 10, (x, y) => {
      const r = Math.hypot(x, y);
      return r <= rim ? (r * r) / (2 * a) : (rim * rim) / (2 * a) - (r - rim) * 0.3;
    });
    const h = Math.atan(rim / (2 * a));
    const { svf, horizon } = shadeCentre(z, grid);
    expect(Math.abs(svf - Math.cos(h) ** 2)).toBeLessThan(0.003);
    for (const sector of horizon) expect(Math.abs(sector[2] - h / RAD)).toBeLessThan(0.5);
  });

  it('the centre of a flat-floored crater sees the sky above its rim: R²/(R² + D²)', () => {
    const floor = 300;
    const rim = 700;
    const depth = 400;
    const { z, grid } = surface(201, 10, (x, y) => {
      const r = Math.hypot(x, y);
      return r <= floor ? 0 : r <= rim ? (depth * (r - floor)) / (rim - floor) : depth - (r - rim) * 0.3;
    });
    const { svf, horizon } = shadeCentre(z, grid);
    expect(Math.abs(svf - rim ** 2 / (rim ** 2 + depth ** 2))).toBeLessThan(0.003);
    for (const sector of horizon) expect(Math.abs(sector[2] - Math.atan(depth / rim) / RAD)).toBeLessThan(0.5);
  });

  it("Dozier & Frew's hull walk finds the same horizons as comparing every pair of points", () => {
    const random = valueNoise(9, 40, 4);
    for (const n of [2, 3, 50, 2000]) {
      const position = Float64Array.from({ length: n }, (_, i) => i * 30 + (i % 3));
      const height = Float64Array.from({ length: n }, (_, i) => 3000 + 800 * random(i, 0.5) + (i % 7) * 3);
      const next = new Int32Array(n);
      const slopes = new Float64Array(n);
      profileHorizons(position, height, n, next, slopes);
      for (let i = 0; i < n - 1; i++) {
        let best = -Infinity;
        for (let j = i + 1; j < n; j++) best = Math.max(best, (height[j] - height[i]) / (position[j] - position[i]));
        expect(slopes[i]).toBe(best);
      }
      expect(slopes[n - 1]).toBe(-Infinity);
    }
  });

  it('curvature and refraction lower a summit 20 km away by 0.857·d²/2R', () => {
    const n = 700;
    const cell = 30;
    const grid = { width: n, height: 3, x0: 0, y0: 90, dx: cell, dy: cell };
    const z = new Float32Array(n * 3);
    for (let r = 0; r < 3; r++) z[r * n + (n - 20)] = 1000;
    const out = new Float32Array(z.length);
    horizonTangents(z, grid, 90, out, horizonWork(grid), true);
    const d = (n - 20 - 10) * cell;
    const expected = (1000 - (0.85714 * d * d) / (2 * 6_371_000)) / d;
    expect(out[n + 10]).toBeCloseTo(expected, 6);
  });

  it('refuses sector counts outside 8–72', () => {
    const { z, grid } = surface(11, 30, () => 0);
    expect(() => terrainShading(z, grid, hornGradient(z, grid), new Int32Array(z.length), 1, 4)).toThrow(/8 to 72/);
  });
});

describe('reading the horizon percentiles (the engine contract)', () => {
  const q = [2, 5, 8, 12, 20];
  it('is the piecewise-linear CDF through the five percentiles with uniform tails', () => {
    expect(sunlitFraction(q, 2)).toBeCloseTo(0.1, 12);
    expect(sunlitFraction(q, 6.5)).toBeCloseTo(0.4, 12);
    expect(sunlitFraction(q, 20)).toBeCloseTo(0.9, 12);
    expect(sunlitFraction(q, 0.5)).toBe(0); // lower end p10 − (p30 − p10)/2
    expect(sunlitFraction(q, 1.25)).toBeCloseTo(0.05, 12);
    expect(sunlitFraction(q, 24)).toBe(1); // upper end p90 + (p90 − p70)/2
    expect(sunlitFraction(q, 22)).toBeCloseTo(0.95, 12);
  });
  it('rises with the sun and makes a step where percentiles coincide', () => {
    let previous = 0;
    for (let e = -5; e <= 30; e += 0.25) {
      const f = sunlitFraction(q, e);
      expect(f).toBeGreaterThanOrEqual(previous);
      previous = f;
    }
    expect(sunlitFraction([10, 10, 10, 10, 10], 9.99)).toBe(0);
    expect(sunlitFraction([10, 10, 10, 10, 10], 10.01)).toBe(1);
  });
});

describe('fast arctangent', () => {
  it('stays within 2·10⁻⁸ rad of Math.atan (Abramowitz & Stegun 4.4.49)', () => {
    let worst = 0;
    for (let i = -20000; i <= 20000; i++) worst = Math.max(worst, Math.abs(fastAtan(i / 200) - Math.atan(i / 200)));
    expect(worst).toBeLessThan(2e-8);
  });
});
