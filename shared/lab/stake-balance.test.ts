import { describe, expect, it } from 'vitest';
import { simulate } from '../melt/index';
import { steadyClimate } from '../melt/fixtures/steady-climate';
import { inventedValley } from '../melt/fixtures/invented-valley';
import { bandAt, compareStakes } from './stake-balance';

describe('stake mass balance from the engine', () => {
  it('finds the band holding a stake, or the nearest one', () => {
    const bands = [{ lowerM: 3000, upperM: 3200 }, { lowerM: 3200, upperM: 3400 }].map((b) => ({ ...b, areaKm2: 1, slopeDeg: 0, aspectDeg: 0, glacierFraction: 1, debrisFraction: 0, debrisThicknessM: 0 }));
    expect(bandAt(bands, 3200)).toBe(1);
    expect(bandAt(bands, 3100)).toBe(0);
    expect(bandAt(bands, 2500)).toBe(0);
    expect(bandAt(bands, 3900)).toBe(1);
  });
  it('equals minus the ice lost (melt and vapour) per glacier area on snow-free ice without precipitation', () => {
    const site = steadyClimate({ days: 10, meanC: 4, bands: [{ glacierFraction: 0.5 }] });
    const run = simulate(site);
    const iceMm = run.bandTotals.iceMeltMm[0] + run.bandTotals.iceVapourLossMm[0];
    const comparison = compareStakes(site, [
      { stake: 'A', elevationM: 3000, from: '2022-07-01', to: '2022-07-10', balanceMWe: -0.5 },
      { stake: 'B', elevationM: 3050, from: '2022-07-01', to: '2022-07-05', balanceMWe: -0.2 },
      { stake: 'C', elevationM: 3000, from: '2022-06-01', to: '2022-07-05', balanceMWe: -0.2 },
    ]);
    expect(comparison.outsideRecord).toBe(1);
    expect(comparison.readings[0].simulatedMWe).toBeCloseTo(-iceMm / 0.5 / 1000, 9);
    expect(comparison.readings[1].simulatedMWe).toBeGreaterThan(comparison.readings[0].simulatedMWe);
    const errors = comparison.readings.map((r) => r.simulatedMWe - r.balanceMWe);
    expect(comparison.meanErrorMWe).toBeCloseTo((errors[0] + errors[1]) / 2, 12);
  });
  it('gives higher balances higher up over a year of the invented valley', () => {
    const valley = inventedValley({ bandCount: 6, timeStep: 'daily' });
    const readings = [2500, 3200, 3900].map((z, i) => ({ stake: `S${i}`, elevationM: z, from: '2021-10-01', to: '2022-09-30', balanceMWe: [-2, -0.5, 0.8][i] }));
    const comparison = compareStakes(valley, readings);
    const simulated = comparison.readings.map((r) => r.simulatedMWe);
    expect(simulated[1]).toBeGreaterThan(simulated[0]);
    expect(simulated[2]).toBeGreaterThan(simulated[1]);
    expect(comparison.scores!.count).toBe(3);
  });
});
