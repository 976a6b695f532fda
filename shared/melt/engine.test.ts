import { describe, expect, it } from 'vitest';
import { simulate, simulateDegreeDay, simulateEnhancedTemperatureIndex } from './simulate';
import { BAND_DAY_FIELDS, type SimulationResult } from './result';
import { bandWaterBalance } from './water-balance';
import { inventedValley } from './fixtures/invented-valley';
import { steadyClimate } from './fixtures/steady-climate';
import type { SimulationInput } from './schema';

/** Water the band gave: with no precipitation, runoff grows with the energy that reached snow and ice. */
const surfaceMelt = (r: SimulationResult, b: number) => r.bandTotals.runoffMm[b];
const withScenario = (input: SimulationInput, scenario: SimulationInput['scenario']): SimulationInput => ({ ...input, scenario });
const valley = inventedValley({ years: 1, bandCount: 6 });
const finite = (r: SimulationResult) => BAND_DAY_FIELDS.every((f) => r.bandDay[f].every(Number.isFinite));

describe('property: darker surfaces never melt less', () => {
  // A deep pack over glacier and debris bands, no precipitation: more absorbed sunshine is the only change.
  const summer = steadyClimate({ days: 60, start: '2022-06-15', meanC: 2, bands: [{}, { debrisFraction: 0.5, debrisThicknessM: 0.02 }, { glacierFraction: 0 }], initialSweMm: [600, 600, 600] });
  const runs = [0, 30, 300, 3000].map((bc) => simulate(withScenario(summer, { blackCarbonSnowNgG: bc, blackCarbonIceNgG: bc, dustSnowUgG: bc / 30, dustIceUgG: bc / 30 })));
  it('more black carbon and dust never lowers runoff in any band', () => {
    for (let i = 1; i < runs.length; i++) for (let b = 0; b < 3; b++) expect(surfaceMelt(runs[i], b)).toBeGreaterThanOrEqual(surfaceMelt(runs[i - 1], b) - 1e-6);
  });
  it('and it does raise melt', () => {
    expect(surfaceMelt(runs[3], 0)).toBeGreaterThan(surfaceMelt(runs[0], 0) * 1.1);
  });
  it('dry deposition in July darkens July only', () => {
    const july = Array.from({ length: 12 }, (_, m) => (m === 6 ? 200 : 0));
    const dusted = simulate(withScenario(summer, { blackCarbonDepositionUgM2Day: july }));
    // 2022-06-15 + 16 days = 1 July
    expect(dusted.bandDay.albedo.slice(0, 16)).toEqual(runs[0].bandDay.albedo.slice(0, 16));
    expect(dusted.bandDay.albedo[40]).toBeLessThan(runs[0].bandDay.albedo[40]);
  });
});

describe('property: warmer never melts less (no precipitation)', () => {
  const dry = (dT: number) => simulate(withScenario(
    steadyClimate({ days: 60, start: '2022-06-01', meanC: 0, bands: [{}, { debrisFraction: 0.5, debrisThicknessM: 0.1 }, { glacierFraction: 0 }], initialSweMm: [400, 400, 400] }),
    { temperatureDeltaC: dT },
  ));
  const runs = [-2, 0, 1, 3].map(dry);
  it('every band melts at least as much when warmer', () => {
    for (let i = 1; i < runs.length; i++) for (let b = 0; b < 3; b++) expect(surfaceMelt(runs[i], b)).toBeGreaterThanOrEqual(surfaceMelt(runs[i - 1], b) - 1e-6);
  });
});

describe('debris like measured debris', () => {
  // A clear Himalayan summer fortnight at 3000 m, 28° N, 6 °C mean, on snow-free ice.
  const debrisRun = (h: number) => simulate(steadyClimate({ days: 20, meanC: 6, latitudeDeg: 28, bands: [{ debrisFraction: 0.5, debrisThicknessM: h }], initialSweMm: [0] }));
  const thicknesses = [0.002, 0.005, 0.01, 0.02, 0.03, 0.05, 0.1, 0.2, 0.5, 1, 2];
  const runs = thicknesses.map(debrisRun);
  // Each surface covers half the band, so the per-area ratio is the plain ratio.
  const ratio = (r: SimulationResult) => r.bandTotals.debrisIceMeltMm[0] / r.bandTotals.iceMeltMm[0];
  const ratios = runs.map(ratio);
  it('the Østrem curve rises under thin, patchy debris and peaks between 0.5 and 2 cm (field curves: Østrem 1959; Mattson et al. 1993; Nicholson & Benn 2006) [memory]', () => {
    const peak = thicknesses[ratios.indexOf(Math.max(...ratios))];
    expect(peak).toBeGreaterThanOrEqual(0.005);
    expect(peak).toBeLessThanOrEqual(0.02);
    expect(ratios[0]).toBeLessThan(ratios[2]);
    expect(ratios[0]).toBeGreaterThan(1);
  });
  it('the critical thickness (melt equal to clean ice) lies between 1.5 and 5 cm (same field curves) [memory]', () => {
    const critical = thicknesses.find((h, i) => i > 0 && ratios[i] < 1 && ratios[i - 1] >= 1)!;
    expect(critical).toBeGreaterThan(0.015);
    expect(critical).toBeLessThanOrEqual(0.05);
  });
  it('0.5 m of debris suppresses melt strongly (below 30 % of clean ice) and thicker debris never melts more', () => {
    expect(ratios[8]).toBeLessThan(0.3);
    for (let i = 4; i < runs.length; i++) expect(ratios[i]).toBeLessThanOrEqual(ratios[i - 1]);
  });
  it('above 5 cm the reduction follows the hyperbolic form H*/(H* + h) (Anderson & Anderson 2016) within a factor of 2', () => {
    for (const i of [5, 6, 7, 8, 9]) {
      const hyperbolic = 0.066 / (0.066 + thicknesses[i]);
      expect(ratios[i] / hyperbolic).toBeGreaterThan(0.5);
      expect(ratios[i] / hyperbolic).toBeLessThan(2);
    }
  });
  it('midday surface temperatures of continuous debris (≥ 5 cm) stay within the 20–40 °C measured on Himalayan debris (e.g. Nicholson & Benn 2006; Rounce et al. 2015) [memory]', () => {
    for (const i of [5, 6, 7, 8, 9, 10]) {
      const peak = Math.max(...runs[i].bandDay.debrisSurfaceMaxC.slice(5));
      expect(peak).toBeGreaterThan(20);
      expect(peak).toBeLessThan(40);
    }
  });
});

describe('property: water and energy close', () => {
  for (const [name, run] of [['energy balance', simulate], ['degree-day', simulateDegreeDay], ['enhanced temperature index', simulateEnhancedTemperatureIndex]] as const) {
    it(`${name}: precipitation + glacier ice lost = runoff + sublimation + evaporation + storage change, to 10⁻⁹ relative in every band`, () => {
      const r = run(inventedValley({ years: 2, bandCount: 6 }));
      for (let b = 0; b < r.bandCount; b++) {
        const w = bandWaterBalance(r, b);
        expect(Math.abs(w.residualMm)).toBeLessThan(1e-9 * (w.precipitationMm + w.glacierIceLossMm));
      }
      const t = r.bandTotals;
      let volume = 0;
      for (let b = 0; b < r.bandCount; b++) {
        expect(t.runoffMm[b]).toBeCloseTo(t.snowMeltMm[b] + t.iceMeltMm[b] + t.debrisIceMeltMm[b] + t.rainMm[b], 6);
        volume += (t.runoffMm[b] / 1000) * r.bands.areaM2[b];
      }
      expect(r.catchmentDaily.volumeM3.total.reduce((a, v) => a + v, 0)).toBeCloseTo(volume, 3);
    });
  }
  it('glacier-free ground melts snow only, and all of it', () => {
    const r = simulate(steadyClimate({ days: 20, meanC: 10, bands: [{ glacierFraction: 0 }], initialSweMm: [20] }));
    expect(r.bandTotals.snowMeltMm[0] + r.bandTotals.sublimationMm[0] + r.bandTotals.evaporationMm[0]).toBeCloseTo(20, 6);
    expect(r.bandTotals.iceMeltMm[0] + r.bandTotals.debrisIceMeltMm[0]).toBe(0);
  });
  it('ice melts only where the snow has gone: never on a day the band is fully snow-covered', () => {
    const r = simulate(steadyClimate({ days: 40, meanC: 4, initialSweMm: [300] }));
    const f = r.bandDay;
    for (let d = 0; d < r.dayCount; d++) if (f.snowCoverFraction[d] >= 1) expect(f.iceMeltMm[d]).toBe(0);
    expect(r.bandTotals.iceMeltMm[0]).toBeGreaterThan(0);
  });
});

describe('snow cover retreats smoothly within a band (lognormal SWE, Liston 2004)', () => {
  const r = simulate(steadyClimate({ days: 90, meanC: 6, initialSweMm: [400] }));
  const cover = Array.from(r.bandDay.snowCoverFraction);
  it('takes more than a week from full cover to almost bare ice (below 5 %), never dropping by more than a fifth of the band in a day', () => {
    const partial = cover.filter((c) => c > 0.02 && c < 0.98).length;
    expect(partial).toBeGreaterThan(7);
    for (let d = 1; d < cover.length; d++) expect(cover[d - 1] - cover[d]).toBeLessThan(0.2);
    expect(cover[cover.length - 1]).toBeLessThan(0.05);
  });
  it('exposes ice gradually: ice melt rises as the cover shrinks', () => {
    const ice = r.bandDay.iceMeltMm;
    const firstIce = Array.from(ice).findIndex((v) => v > 0.01);
    const bare = cover.findIndex((c) => c < 0.05);
    expect(firstIce).toBeGreaterThan(0);
    expect(bare).toBeGreaterThan(firstIce + 5);
    expect(ice[firstIce + 1]).toBeLessThan(ice[bare]);
  });
});

describe('property: slopes, hemispheres and horizons', () => {
  const slopes = [{ slopeDeg: 30, aspectDeg: 180 }, { slopeDeg: 30, aspectDeg: 0 }];
  it('a south-facing slope gets more sun than a north-facing one in the northern hemisphere', () => {
    const r = simulate(steadyClimate({ days: 3, start: '2022-06-20', latitudeDeg: 46, bands: slopes, initialSweMm: [0, 0] }));
    expect(r.bandDay.incomingShortwaveWm2[0]).toBeGreaterThan(r.bandDay.incomingShortwaveWm2[r.dayCount]);
  });
  it('and less in the southern hemisphere', () => {
    const r = simulate(steadyClimate({ days: 3, start: '2022-12-20', latitudeDeg: -46, bands: slopes, initialSweMm: [0, 0] }));
    expect(r.bandDay.incomingShortwaveWm2[0]).toBeLessThan(r.bandDay.incomingShortwaveWm2[r.dayCount]);
  });
  it('a ridge in the south cuts the direct beam: a band behind a 60° southern horizon gets only diffuse light at noon in winter', () => {
    const sectors = Array.from({ length: 36 }, (_, k) => (Math.abs(k * 10 - 180) <= 60 ? [58, 59, 60, 61, 62] : [0, 0, 0, 0, 0]));
    const open = steadyClimate({ days: 3, start: '2022-12-20', latitudeDeg: 46, initialSweMm: [0, 0], bands: [{}, { horizonDeg: sectors, skyViewFactor: 0.7 }] });
    const r = simulate(open);
    expect(r.bandDay.incomingShortwaveWm2[r.dayCount + 1]).toBeLessThan(0.5 * r.bandDay.incomingShortwaveWm2[1]);
  });
  it('runs through polar day and polar night without NaN', () => {
    for (const [lat, start] of [[78, '2022-06-01'], [78, '2022-12-01'], [-78, '2022-06-01'], [-78, '2022-12-01']] as const) {
      const r = simulate(steadyClimate({ days: 10, start, latitudeDeg: lat, meanC: 2, initialSweMm: [0] }));
      const polarDay = (lat > 0) === (start.slice(5, 7) === '06');
      if (polarDay) expect(r.bandDay.incomingShortwaveWm2[0]).toBeGreaterThan(100);
      else expect(r.bandDay.incomingShortwaveWm2[0]).toBe(0);
      expect(finite(r)).toBe(true);
    }
  });
});

describe('how a run starts', () => {
  const record = inventedValley({ years: 3, bandCount: 4 });
  const season = { from: '2023-04-01', to: '2023-09-30' };
  it('spins up through at least a year before the period, from the start of a hydrological year, and reports only the period', () => {
    const r = simulate({ ...record, period: season });
    expect(r.start).toMatchObject({ method: 'spin-up-record', spinUpFrom: '2021-10-01', spinUpTo: '2023-03-31', spinUpDays: 547, adequate: true });
    expect(r.startDate).toBe('2023-04-01');
    expect(r.dayCount).toBe(183);
    expect(r.bandTotals.sweStartMm[3]).toBeGreaterThan(100);
  });
  it('accepts a shorter stretch that still covers the accumulation season, and says so', () => {
    const r = simulate({ ...record, period: { from: '2022-04-01', to: '2022-09-30' } });
    expect(r.start).toMatchObject({ method: 'spin-up-record', spinUpDays: 182, adequate: true });
    expect(r.start.note).toMatch(/182 days of record .*547 wanted/);
  });
  it('repeats the period\'s first year when the record starts with the period, and says the record was too short', () => {
    const r = simulate({ ...record, period: { from: '2021-10-01', to: '2022-09-30' } });
    expect(r.start).toMatchObject({ method: 'spin-up-repeated-year', spinUpFrom: '2021-10-01', spinUpTo: '2022-09-30', adequate: false });
    expect(r.start.note).toMatch(/too late for a spin-up/);
  });
  it('starts from a given snow water equivalent per band without spin-up', () => {
    const r = simulate({ ...record, period: season, start: { method: 'initial-swe', sweMm: [0, 100, 200, 300] } });
    expect(r.start.method).toBe('initial-swe');
    expect(Array.from(r.bandTotals.sweStartMm)).toEqual([0, 100, 200, 300]);
  });
  it('a run started from another run\'s end state continues it exactly', () => {
    const whole = simulate({ ...record, period: { from: '2022-10-01', to: '2023-09-30' } });
    const first = simulate({ ...record, period: { from: '2022-10-01', to: '2023-03-31' } });
    const second = simulate({ ...record, period: { from: '2023-04-01', to: '2023-09-30' }, start: { method: 'state', state: first.endState } });
    for (let b = 0; b < 4; b++) expect(second.bandTotals.runoffMm[b] + first.bandTotals.runoffMm[b]).toBeCloseTo(whole.bandTotals.runoffMm[b], 9);
  });
  it('a longer spin-up changes a season\'s runoff by less than 3 % in every band', () => {
    const longer = inventedValley({ years: 4, bandCount: 4 });
    const later = { from: '2024-04-01', to: '2024-09-30' };
    const one = simulate({ ...longer, period: later });
    const two = simulate({ ...longer, period: later, start: { method: 'spin-up', years: 2 } });
    expect([one.start.spinUpDays, two.start.spinUpDays]).toEqual([548, 913]);
    for (let b = 0; b < 4; b++) expect(Math.abs(two.bandTotals.runoffMm[b] - one.bandTotals.runoffMm[b])).toBeLessThan(0.03 * one.bandTotals.runoffMm[b] + 1);
  });
});

describe('simulate', () => {
  it('leaves its input unchanged, records the engine version and never returns NaN under extreme loads', () => {
    const input = structuredClone(valley);
    const extreme = { ...input, scenario: { blackCarbonSnowNgG: 50_000, blackCarbonIceNgG: 50_000, dustSnowUgG: 5000, dustIceUgG: 5000, temperatureDeltaC: 15, debrisThicknessChangeM: -10, debrisExtentChange: 1 } };
    const r = simulate(extreme);
    expect(input).toEqual(valley);
    expect(r.engineVersion).toMatch(/^2\.\d+\.\d+$/);
    expect(r.layout).toBe('band-major');
    expect(finite(r)).toBe(true);
  });
  it('reports progress after each month, spin-up included, and ends at 1', () => {
    const seen: number[] = [];
    simulate(valley, { onProgress: (p) => seen.push(p.fraction) });
    expect(seen.length).toBe(24);
    expect(seen[seen.length - 1]).toBe(1);
    for (let i = 1; i < seen.length; i++) expect(seen[i]).toBeGreaterThan(seen[i - 1]);
  });
  it('daily forcing is disaggregated to hours and gives finite results', () => {
    const r = simulate(inventedValley({ years: 1, timeStep: 'daily' }));
    expect(r.dayCount).toBe(365);
    expect(finite(r)).toBe(true);
    expect(r.bandTotals.snowMeltMm[0]).toBeGreaterThan(0);
  });
  it('simulates only the requested period', () => {
    const r = simulate({ ...valley, period: { from: '2022-06-01', to: '2022-06-30' } });
    expect(r.startDate).toBe('2022-06-01');
    expect(r.dayCount).toBe(30);
  });
});

describe('property: more precipitation never lowers runoff (ice-free bands, a year after its spin-up)', () => {
  // Without glacier ice a wetter year can only add water where the snow melts out every year. Where
  // snow outlasts the summer, more snow keeps the band white longer and is carried over instead, so
  // there the property is the water the band gives or keeps: runoff plus the change in its snow.
  // (On glaciers more snow may also shield the ice and lower melt within a season.)
  const iceFree = inventedValley({ years: 2, bandCount: 5, timeStep: 'daily', seed: 11 });
  const input = { ...iceFree, catchment: { ...iceFree.catchment, bands: iceFree.catchment.bands.map((b) => ({ ...b, glacierFraction: 0, debrisFraction: 0 })) }, period: { from: '2022-10-01', to: '2023-09-30' } };
  const runs = [0.5, 0.8, 1, 1.3, 2].map((f) => simulate(withScenario(input, { precipitationFactor: f })));
  const seasonal = [0, 1, 2, 3, 4].filter((b) => runs.every((r) => r.bandTotals.sweStartMm[b] === 0 && r.bandTotals.sweEndMm[b] === 0));
  it('in every band whose snow melts out every year', () => {
    expect(seasonal.length).toBeGreaterThan(0);
    for (let i = 1; i < runs.length; i++) for (const b of seasonal) expect(runs[i].bandTotals.runoffMm[b]).toBeGreaterThan(runs[i - 1].bandTotals.runoffMm[b]);
  });
  it('counting the snow a band keeps, in every band', () => {
    const given = (r: SimulationResult, b: number) => r.bandTotals.runoffMm[b] + r.bandTotals.sweEndMm[b] - r.bandTotals.sweStartMm[b];
    for (let i = 1; i < runs.length; i++) for (let b = 0; b < 5; b++) expect(given(runs[i], b)).toBeGreaterThan(given(runs[i - 1], b));
  });
  it('with snow moved between bands and routed to the outlet, for the outlet and the snow left in the catchment', () => {
    const moved = [0.5, 0.8, 1, 1.3].map((f) => simulate({ ...withScenario(input, { precipitationFactor: f }), redistribution: { avalanche: { parameters: {} }, windDrift: { factors: [0.8, 1, 1.2, 1, 0.9] } }, routing: { parameters: {} } }));
    const kept = (r: SimulationResult) => r.bands.areaM2.reduce((s, a, b) => s + (a * (r.bandTotals.sweEndMm[b] - r.bandTotals.sweStartMm[b])) / 1000, 0);
    const outlet = (r: SimulationResult) => r.catchmentDaily.routed!.volumeM3.total.reduce((s, v) => s + v, 0);
    for (let i = 1; i < moved.length; i++) expect(outlet(moved[i]) + kept(moved[i])).toBeGreaterThan(outlet(moved[i - 1]) + kept(moved[i - 1]));
  });
});
