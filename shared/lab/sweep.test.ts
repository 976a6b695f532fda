import { describe, expect, it } from 'vitest';
import { inventedValley } from '../melt/fixtures/invented-valley';
import { simulate } from '../melt/index';
import { axisValues, baselineMelt, prepareSweep, runSweep, sweepCells } from './sweep';

const valley = inventedValley({ bandCount: 4, timeStep: 'daily' });
const period = { from: '2022-06-01', to: '2022-08-31' };

describe('parameter sweeps', () => {
  it('spaces axis values evenly, both ends included, and refuses more than 20 steps', () => {
    expect(axisValues({ variable: 'temperatureDeltaC', from: 0, to: 3, steps: 4 })).toEqual([0, 1, 2, 3]);
    expect(() => axisValues({ variable: 'temperatureDeltaC', from: 0, to: 3, steps: 21 })).toThrow(/2 to 20 steps/);
  });
  it('lays a two-axis grid out row by row', () => {
    const cells = sweepCells({ period, axes: [{ variable: 'temperatureDeltaC', from: 0, to: 1, steps: 2 }, { variable: 'iceAlbedo', from: 0.3, to: 0.4, steps: 3 }] });
    expect(cells.map((c) => c.index)).toEqual([[0, 0], [0, 1], [0, 2], [1, 0], [1, 1], [1, 2]]);
    expect(cells[5].values[0]).toBe(1);
    expect(cells[5].values[1]).toBeCloseTo(0.4, 12);
  });
  it('adds nothing at the baseline and more melt with warming and black carbon', () => {
    const result = runSweep(valley, { period, axes: [{ variable: 'temperatureDeltaC', from: 0, to: 2, steps: 3 }, { variable: 'blackCarbonIceNgG', from: 0, to: 2000, steps: 3 }] });
    expect(result.meltMm).toHaveLength(3);
    expect(result.addedMeltMm[0][0]).toBeCloseTo(0, 9);
    for (let i = 0; i < 3; i++) {
      for (let j = 0; j < 3; j++) {
        if (i > 0) expect(result.addedMeltMm[i][j]).toBeGreaterThan(result.addedMeltMm[i - 1][j]);
        if (j > 0) expect(result.addedMeltMm[i][j]).toBeGreaterThan(result.addedMeltMm[i][j - 1]);
      }
    }
    expect(result.axes[1].label).toBe('Black carbon on ice');
  });
  it('applies engine parameters too: a darker clean-ice albedo melts more', () => {
    const result = runSweep(valley, { period, axes: [{ variable: 'iceAlbedo', from: 0.5, to: 0.3, steps: 3 }] });
    expect(result.meltMm).toHaveLength(1);
    expect(result.meltMm[0][2]).toBeGreaterThan(result.meltMm[0][0]);
    expect(result.addedMeltMm[0][0]).toBeLessThan(0);
  });
});

describe('sweep spin-up', () => {
  it('starts from the baseline snowpack, so the baseline cell is close to a continuous run over the period', () => {
    const plan = { period: { from: '2022-04-01', to: '2022-08-31' }, axes: [] };
    const setup = prepareSweep(valley, plan);
    const start = setup.start;
    expect(start.method).toBe('state');
    if (start.method === 'state') expect(Math.max(...start.state.sweMm)).toBeGreaterThan(100);
    const continuous = simulate({ ...valley, period: { from: valley.forcing.start, to: plan.period.to } });
    const first = 182; // 2021-10-01 + 182 days = 2022-04-01
    let volume = 0;
    for (const s of ['snow', 'ice', 'debrisIce'] as const) for (let d = first; d < continuous.dayCount; d++) volume += continuous.catchmentDaily.volumeM3[s][d];
    const area = continuous.bands.areaM2.reduce((a, b) => a + b, 0);
    // the cells start from the baseline's full state (snow, temperatures, grains, loads), so they continue it closely
    expect(baselineMelt(setup) / ((volume / area) * 1000)).toBeCloseTo(1, 1);
  });
});
