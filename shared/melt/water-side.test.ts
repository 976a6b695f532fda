import { describe, expect, it } from 'vitest';
import { simulate } from './simulate';
import { SOURCES, type SimulationResult } from './result';
import { bandWaterBalance } from './water-balance';
import { inventedValley } from './fixtures/invented-valley';
import { bandClimate } from '../hydrology/band-climate';
import type { SimulationInput } from './schema';

/**
 * The engine's water-side hooks (shared/hydrology/README.md, "Engine hooks"): band climate,
 * loads per band, snow redistribution in the daily step and routing to the outlet. Each is
 * checked against the engine without it (what it must reproduce when it changes nothing) and
 * against conservation of water.
 */
const valley = inventedValley({ years: 2, bandCount: 8, timeStep: 'daily', seed: 11 });
const period = { from: '2022-10-01', to: '2023-09-30' };
const base: SimulationInput = { ...valley, period, parameters: { lapseRateCPerKm: -6, precipitationGradientPerKm: 0.4 } };
const bands = valley.catchment.bands;
const areaKm2 = bands.map((b) => b.areaKm2);
const sum = (xs: ArrayLike<number>) => Array.from(xs).reduce((a, b) => a + b, 0);
const relativeGap = (a: ArrayLike<number>, b: ArrayLike<number>) => Math.max(...Array.from(a, (v, i) => Math.abs(v - b[i]) / (1e-9 + Math.abs(b[i]))));

/** Σ over bands of a per band-day field × band area for each day, mm·km². */
function areaWeightedDaily(r: SimulationResult, field: 'windDriftMm' | 'avalancheMm'): number[] {
  return Array.from({ length: r.dayCount }, (_, d) => bands.reduce((s, _b, b) => s + r.bandDay[field][b * r.dayCount + d] * areaKm2[b], 0));
}

describe('band climate from gradients', () => {
  const legacy = simulate(base);
  it('reproduces the engine’s own lapse rate and gradient when it holds the same numbers', () => {
    const climate = bandClimate({
      bands, referenceElevationM: valley.catchment.stationElevationM,
      lapseRatesKPerKm: Array(12).fill(-6), profiles: Array(12).fill({ kind: 'linear', gradientPerKm: 0.4 }),
    });
    const asArrays = {
      temperatureOffsetK: Array.from(climate.temperatureOffsetK), glacierTemperatureOffsetK: Array.from(climate.glacierTemperatureOffsetK),
      precipitationMultiplier: Array.from(climate.precipitationMultiplier),
    };
    // Different lapse-rate parameters must no longer matter: the band climate replaces them.
    const hooked = simulate({ ...base, parameters: { lapseRateCPerKm: -3 }, bandClimate: asArrays });
    expect(relativeGap(hooked.bandTotals.runoffMm, legacy.bandTotals.runoffMm)).toBeLessThan(1e-12);
    expect(relativeGap(hooked.bandTotals.snowfallMm, legacy.bandTotals.snowfallMm)).toBeLessThan(1e-12);
  });
  it('a katabatic layer that cools the snow-free glacier lowers ice melt and nothing else at first', () => {
    const n = bands.length;
    const offsets = bands.flatMap((b) => Array(12).fill((-6 * ((b.lowerM + b.upperM) / 2 - 2100)) / 1000));
    const cooled = simulate({
      ...base,
      bandClimate: {
        temperatureOffsetK: offsets, glacierTemperatureOffsetK: offsets.map((t) => t - 2), precipitationMultiplier: Array(n * 12).fill(1),
      },
    });
    const plain = simulate({ ...base, bandClimate: { temperatureOffsetK: offsets, glacierTemperatureOffsetK: offsets, precipitationMultiplier: Array(n * 12).fill(1) } });
    expect(sum(cooled.bandTotals.iceMeltMm)).toBeLessThan(0.95 * sum(plain.bandTotals.iceMeltMm));
    expect(sum(cooled.bandTotals.snowfallMm)).toBeCloseTo(sum(plain.bandTotals.snowfallMm), 9);
  });
  it('refuses a band climate of the wrong length, naming the field', () => {
    expect(() => simulate({ ...base, bandClimate: { temperatureOffsetK: [0], glacierTemperatureOffsetK: [0], precipitationMultiplier: [1] } }))
      .toThrow(/bandClimate\.temperatureOffsetK: has 1 values; 96 expected/);
  });
});

describe('impurity loads per band', () => {
  it('equal simulating the bands with each load on their own (bands do not interact without redistribution)', () => {
    const dirty = { blackCarbonSnowNgG: 400, blackCarbonIceNgG: 1500 };
    const together = simulate({ ...base, impuritiesByBand: bands.map((_, b) => (b < 4 ? dirty : null)) });
    const low = simulate({ ...base, scenario: dirty, catchment: { ...base.catchment, bands: bands.slice(0, 4) } });
    const high = simulate({ ...base, catchment: { ...base.catchment, bands: bands.slice(4) } });
    const split = [...low.bandTotals.runoffMm, ...high.bandTotals.runoffMm];
    expect(relativeGap(together.bandTotals.runoffMm, split)).toBeLessThan(1e-12);
  });
});

describe('snow redistribution in the daily step', () => {
  const windFactors = bands.map((_, b) => (b % 2 === 0 ? 0.6 : 1.6));
  const moved = simulate({ ...base, redistribution: { avalanche: { parameters: { minimumHoldingDepthM: 0.05 } }, windDrift: { factors: windFactors } } });
  const still = simulate(base);
  it('conserves mass: what leaves one band arrives in another, every day, to 1e-9', () => {
    for (const field of ['windDriftMm', 'avalancheMm'] as const) {
      const moves = areaWeightedDaily(moved, field);
      const scale = Math.max(1, ...moves.map(Math.abs));
      for (const m of moves) expect(Math.abs(m) / scale).toBeLessThan(1e-9);
    }
    expect(sum(moved.bandTotals.avalancheMm.map(Math.abs))).toBeGreaterThan(0);
    expect(sum(moved.bandTotals.windDriftMm.map(Math.abs))).toBeGreaterThan(0);
  });
  it('closes every band’s water balance with the snow moved counted in', () => {
    for (let b = 0; b < bands.length; b++) {
      const w = bandWaterBalance(moved, b);
      expect(Math.abs(w.residualMm)).toBeLessThan(1e-9 * Math.max(1, w.precipitationMm));
    }
  });
  it('avalanches move snow only downslope: no band above gains what the bands above it lost', () => {
    const order = bands.map((_, b) => b).sort((a, b) => bands[b].lowerM - bands[a].lowerM);
    let fromAbove = 0;
    for (const b of order) {
      fromAbove += moved.bandTotals.avalancheMm[b] * areaKm2[b];
      expect(fromAbove).toBeLessThanOrEqual(1e-6);
    }
    expect(moved.bandTotals.avalancheMm[order[0]]).toBeLessThanOrEqual(0);
  });
  it('switched off, changes nothing', () => {
    const off = simulate({ ...base, redistribution: { avalanche: null, windDrift: null } });
    expect(relativeGap(off.bandTotals.runoffMm, still.bandTotals.runoffMm)).toBeLessThan(1e-15);
    expect(sum(off.bandTotals.avalancheMm)).toBe(0);
  });
  it('keeps the catchment’s water: precipitation, runoff and storage agree with and without it', () => {
    const total = (r: SimulationResult, pick: (b: number) => number) => bands.reduce((s, _b, b) => s + pick(b) * areaKm2[b], 0);
    const snowfall = (r: SimulationResult) => total(r, (b) => r.bandTotals.snowfallMm[b]);
    expect(snowfall(moved)).toBeCloseTo(snowfall(still), 6);
  });
});

describe('routing to the outlet', () => {
  const routed = simulate({ ...base, routing: { parameters: {} } });
  it('keeps the unrouted runoff by source and adds the routed outlet discharge', () => {
    const plain = simulate(base);
    expect(relativeGap(routed.catchmentDaily.volumeM3.total, plain.catchmentDaily.volumeM3.total)).toBeLessThan(1e-15);
    expect(routed.catchmentDaily.routed).not.toBeNull();
    expect(plain.catchmentDaily.routed).toBeNull();
  });
  it('conserves volume: routed + what the stores gained = unrouted, over the period', () => {
    const r = routed.catchmentDaily.routed!;
    const stored = (s: NonNullable<SimulationResult['endState']['routing']>) => SOURCES.reduce((t, k) => t + s.surface[k] + s.groundwater[k], 0);
    // The stores were filled during the spin-up; the period's routed total differs from the period's runoff by the change of storage only.
    const gap = sum(routed.catchmentDaily.volumeM3.total) - sum(r.volumeM3.total);
    expect(Math.abs(gap)).toBeLessThan(0.2 * sum(r.volumeM3.total));
    expect(stored(routed.endState.routing!)).toBeGreaterThan(0);
    for (const s of SOURCES) for (let d = 0; d < routed.dayCount; d++) expect(r.volumeM3[s][d]).toBeGreaterThanOrEqual(0);
  });
  it('continues from a run’s end state as one long run does (the stores carry over)', () => {
    const long = simulate({ ...base, period: { from: '2022-10-01', to: '2023-09-30' }, routing: { parameters: {} } });
    const first = simulate({ ...base, period: { from: '2022-10-01', to: '2023-03-31' }, routing: { parameters: {} } });
    const second = simulate({ ...base, period: { from: '2023-04-01', to: '2023-09-30' }, routing: { parameters: {} }, start: { method: 'state', state: first.endState } });
    const chained = [...first.catchmentDaily.routed!.volumeM3.total, ...second.catchmentDaily.routed!.volumeM3.total];
    expect(relativeGap(chained, long.catchmentDaily.routed!.volumeM3.total)).toBeLessThan(1e-9);
  });
});
