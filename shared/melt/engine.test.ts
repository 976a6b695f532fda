import { describe, expect, it } from 'vitest';
import { simulate, simulateDegreeDay, simulateEnhancedTemperatureIndex } from './simulate';
import { BAND_DAY_FIELDS, type SimulationResult } from './result';
import { inventedValley } from './fixtures/invented-valley';
import { steadyClimate } from './fixtures/steady-climate';
import { LATENT_HEAT_FUSION } from './constants';
import type { SimulationInput } from './schema';

const totalMelt = (r: SimulationResult, b: number) => r.bandTotals.snowMeltMm[b] + r.bandTotals.iceMeltMm[b] + r.bandTotals.debrisIceMeltMm[b];
const withScenario = (input: SimulationInput, scenario: SimulationInput['scenario']): SimulationInput => ({ ...input, scenario });
const valley = inventedValley({ years: 1, bandCount: 6 });

function expectNoLessMelt(lower: SimulationResult, higher: SimulationResult): void {
  for (let b = 0; b < lower.bandCount; b++) expect(totalMelt(higher, b)).toBeGreaterThanOrEqual(totalMelt(lower, b) - 1e-9);
}

describe('property: darker surfaces never melt less', () => {
  const runs = [0, 30, 300, 3000].map((bc) => simulate(withScenario(valley, { blackCarbonSnowNgG: bc, blackCarbonIceNgG: bc, dustSnowUgG: bc / 30, dustIceUgG: bc / 30 })));
  it('more black carbon and dust in snow and ice never lowers melt in any band', () => {
    for (let i = 1; i < runs.length; i++) expectNoLessMelt(runs[i - 1], runs[i]);
  });
  it('and it does raise melt somewhere', () => {
    expect(totalMelt(runs[3], 2)).toBeGreaterThan(totalMelt(runs[0], 2));
  });
  it('monthly loads apply in their month only', () => {
    const july = Array.from({ length: 12 }, (_, m) => (m === 6 ? 3000 : 0));
    const r = simulate(withScenario(valley, { blackCarbonSnowNgG: july }));
    const nd = r.dayCount;
    const b = 2;
    // 2021-10-01 + 273 days = 2022-07-01; June is unchanged, July melts more.
    expect(r.bandDay.snowMeltMm.slice(b * nd + 243, b * nd + 273)).toEqual(runs[0].bandDay.snowMeltMm.slice(b * nd + 243, b * nd + 273));
    expect(r.bandDay.albedo[b * nd + 280]).toBeLessThan(runs[0].bandDay.albedo[b * nd + 280]);
  });
});

describe('property: warmer never melts less (fixed precipitation phase: no precipitation)', () => {
  const dry = (dT: number) => simulate(withScenario(
    steadyClimate({ days: 60, start: '2022-06-01', meanC: 0, bands: [{}, { debrisFraction: 0.5, debrisThicknessM: 0.1 }, { glacierFraction: 0 }], initialSweMm: [400, 400, 400] }),
    { temperatureDeltaC: dT },
  ));
  const runs = [-2, 0, 1, 3].map(dry);
  it('every band melts at least as much when warmer', () => {
    for (let i = 1; i < runs.length; i++) expectNoLessMelt(runs[i - 1], runs[i]);
  });
});

describe('property: debris (Østrem 1959 curve shape [memory])', () => {
  const debrisRun = (h: number) => simulate(steadyClimate({ days: 20, meanC: 6, bands: [{ debrisFraction: 0.5, debrisThicknessM: h }] }));
  const thicknesses = [0.005, 0.01, 0.02, 0.03, 0.05, 0.1, 0.2, 0.5, 1, 2];
  const runs = thicknesses.map(debrisRun);
  // depths are over the band; each surface covers half of it, so the per-area ratio is the plain ratio.
  const ratio = (r: SimulationResult) => r.bandTotals.debrisIceMeltMm[0] / r.bandTotals.iceMeltMm[0];
  it('thin debris (≤ 1 cm) melts more than clean ice', () => {
    expect(ratio(runs[0])).toBeGreaterThan(1);
    expect(ratio(runs[1])).toBeGreaterThan(1);
  });
  it('the critical thickness (melt equal to clean ice) lies between 1 and 10 cm', () => {
    expect(ratio(runs[5])).toBeLessThan(1);
  });
  it('0.5 m of debris suppresses melt strongly (below 30 % of clean ice)', () => {
    expect(ratio(runs[7])).toBeLessThan(0.3);
  });
  it('thicker debris never raises sub-debris melt', () => {
    for (let i = 1; i < runs.length; i++) expect(runs[i].bandTotals.debrisIceMeltMm[0]).toBeLessThanOrEqual(runs[i - 1].bandTotals.debrisIceMeltMm[0]);
  });
  it('above a few cm the reduction follows the hyperbolic form H*/(H* + h) (Anderson & Anderson 2016) within a factor of 2', () => {
    for (const i of [5, 6, 7, 8]) {
      const hyperbolic = 0.066 / (0.066 + thicknesses[i]);
      expect(ratio(runs[i]) / hyperbolic).toBeGreaterThan(0.5);
      expect(ratio(runs[i]) / hyperbolic).toBeLessThan(2);
    }
  });
});

describe('property: energy and mass close', () => {
  it('melt energy equals the summed surplus when every hour is a surplus (warm clean ice, no snow)', () => {
    const r = simulate(steadyClimate({ days: 5, meanC: 18, rangeC: 4, bands: [{ glacierFraction: 0.6 }] }));
    for (let d = 0; d < r.dayCount; d++) {
      const f = r.bandDay;
      const surplusJ = (f.netShortwaveWm2[d] + f.netLongwaveWm2[d] + f.sensibleHeatWm2[d]) * 86400;
      const meltPerIceArea = f.iceMeltMm[d] / 0.6;
      expect(meltPerIceArea * LATENT_HEAT_FUSION).toBeCloseTo(surplusJ, 3);
    }
  });
  for (const [name, run] of [['energy balance', simulate], ['degree-day', simulateDegreeDay], ['enhanced temperature index', simulateEnhancedTemperatureIndex]] as const) {
    it(`${name}: snowfall + rain = snowmelt + rain runoff + storage change, day by day and in total`, () => {
      const r = run({ ...valley, initialState: { sweMm: [0, 0, 50, 100, 200, 300] } });
      const nd = r.dayCount;
      for (let b = 0; b < r.bandCount; b++) {
        let previous = r.bandTotals.sweStartMm[b];
        for (let d = 0; d < nd; d++) {
          const i = b * nd + d;
          expect(r.bandDay.sweMm[i] - previous).toBeCloseTo(r.bandDay.snowfallMm[i] - r.bandDay.snowMeltMm[i], 9);
          previous = r.bandDay.sweMm[i];
        }
        const t = r.bandTotals;
        expect(t.snowfallMm[b] - t.snowMeltMm[b]).toBeCloseTo(t.sweEndMm[b] - t.sweStartMm[b], 6);
        expect(t.runoffMm[b]).toBeCloseTo(t.snowMeltMm[b] + t.iceMeltMm[b] + t.debrisIceMeltMm[b] + t.rainMm[b], 6);
      }
      let volume = 0;
      for (let b = 0; b < r.bandCount; b++) volume += (r.bandTotals.runoffMm[b] / 1000) * r.bands.areaM2[b];
      expect(r.catchmentDaily.volumeM3.total.reduce((a, v) => a + v, 0)).toBeCloseTo(volume, 3);
    });
  }
  it('glacier-free ground melts snow only', () => {
    const r = simulate(steadyClimate({ days: 10, meanC: 10, bands: [{ glacierFraction: 0 }], initialSweMm: [20] }));
    expect(r.bandTotals.snowMeltMm[0]).toBeCloseTo(20, 9);
    expect(r.bandTotals.iceMeltMm[0] + r.bandTotals.debrisIceMeltMm[0]).toBe(0);
  });
  it('ice melts only once its snow is gone', () => {
    const r = simulate(steadyClimate({ days: 30, meanC: 4, initialSweMm: [150] }));
    const f = r.bandDay;
    // no snowfall here, so snow left at the end of a day covered the ice all day
    for (let d = 0; d < r.dayCount; d++) if (f.sweMm[d] > 0) expect(f.iceMeltMm[d]).toBe(0);
    expect(f.sweMm[r.dayCount - 1]).toBe(0);
    expect(r.bandTotals.iceMeltMm[0]).toBeGreaterThan(0);
  });
});

describe('property: slopes and hemispheres', () => {
  const slopes = [{ slopeDeg: 30, aspectDeg: 180 }, { slopeDeg: 30, aspectDeg: 0 }];
  it('a south-facing slope gets more sun than a north-facing one in the northern hemisphere', () => {
    const r = simulate(steadyClimate({ days: 3, start: '2022-06-20', latitudeDeg: 46, bands: slopes }));
    expect(r.bandDay.incomingShortwaveWm2[0]).toBeGreaterThan(r.bandDay.incomingShortwaveWm2[r.dayCount]);
  });
  it('and less in the southern hemisphere', () => {
    const r = simulate(steadyClimate({ days: 3, start: '2022-12-20', latitudeDeg: -46, bands: slopes }));
    expect(r.bandDay.incomingShortwaveWm2[0]).toBeLessThan(r.bandDay.incomingShortwaveWm2[r.dayCount]);
  });
  it('runs through polar day and polar night without NaN', () => {
    for (const [lat, start] of [[78, '2022-06-01'], [78, '2022-12-01'], [-78, '2022-06-01'], [-78, '2022-12-01']] as const) {
      const r = simulate(steadyClimate({ days: 10, start, latitudeDeg: lat, meanC: 2 }));
      const polarDay = (lat > 0) === (start.slice(5, 7) === '06');
      if (polarDay) expect(r.bandDay.incomingShortwaveWm2[0]).toBeGreaterThan(100);
      else expect(r.bandDay.incomingShortwaveWm2[0]).toBe(0);
      for (const field of BAND_DAY_FIELDS) for (const v of r.bandDay[field]) expect(Number.isFinite(v)).toBe(true);
    }
  });
});

describe('simulate', () => {
  it('leaves its input unchanged, records the engine version and never returns NaN under extreme loads', () => {
    const input = structuredClone(valley);
    const extreme = { ...input, scenario: { blackCarbonSnowNgG: 50_000, blackCarbonIceNgG: 50_000, dustSnowUgG: 5000, dustIceUgG: 5000, temperatureDeltaC: 15, debrisThicknessChangeM: -10, debrisExtentChange: 1 } };
    const r = simulate(extreme);
    expect(input).toEqual(valley);
    expect(r.engineVersion).toMatch(/^\d+\.\d+\.\d+$/);
    expect(r.layout).toBe('band-major');
    for (const field of BAND_DAY_FIELDS) for (const v of r.bandDay[field]) expect(Number.isFinite(v)).toBe(true);
  });
  it('reports progress after each month and ends at 1', () => {
    const seen: number[] = [];
    simulate(valley, { onProgress: (p) => seen.push(p.fraction) });
    expect(seen.length).toBe(12);
    expect(seen[seen.length - 1]).toBe(1);
    for (let i = 1; i < seen.length; i++) expect(seen[i]).toBeGreaterThan(seen[i - 1]);
  });
  it('daily forcing is disaggregated to hours and gives finite results', () => {
    const r = simulate(inventedValley({ years: 1, timeStep: 'daily' }));
    expect(r.dayCount).toBe(365);
    for (const field of BAND_DAY_FIELDS) for (const v of r.bandDay[field]) expect(Number.isFinite(v)).toBe(true);
    expect(r.bandTotals.snowMeltMm[0]).toBeGreaterThan(0);
  });
  it('simulates only the requested period', () => {
    const r = simulate({ ...valley, period: { from: '2022-06-01', to: '2022-06-30' } });
    expect(r.startDate).toBe('2022-06-01');
    expect(r.dayCount).toBe(30);
  });
});
