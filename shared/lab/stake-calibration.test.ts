import { describe, expect, it } from 'vitest';
import { inventedValley } from '../melt/fixtures/invented-valley';
import { DEFAULT_CALIBRATION_SET, siteWith } from './calibration-set';
import { compareStakes } from './stake-balance';
import { calibrateToStakes, readingsWithin } from './stake-calibration';

// Synthetic stakes: balances simulated with a known lapse rate are the "measurements".
const valley = inventedValley({ bandCount: 6, timeStep: 'daily', years: 2 });
const truth = { parameters: { lapseRateCPerKm: -5.2 }, precipitationFactor: 1 };
const stakes = [2900, 3300, 3600, 3900].flatMap((elevationM, i) => ['2021', '2022'].map((year) => ({
  stake: `S${i}`, elevationM, from: `${year}-10-01`, to: `${Number(year) + 1}-09-30`, balanceMWe: 0,
}))).filter((r) => r.to <= '2023-09-30');
const truthSim = compareStakes(siteWith(valley, truth), stakes).readings;
const measured = truthSim.map((r) => ({ stake: r.stake, elevationM: r.elevationM, from: r.from, to: r.to, balanceMWe: r.simulatedMWe }));

describe('calibration against stake balances', () => {
  it('keeps only readings inside the period', () => {
    expect(readingsWithin(measured, { from: '2021-10-01', to: '2022-09-30' })).toHaveLength(4);
  });
  it('recovers a known lapse rate from stake balances alone (within 0.2 °C/km)', () => {
    const outcome = calibrateToStakes(valley, measured, { keys: ['lapseRateCPerKm'], period: { from: '2021-10-01', to: '2023-09-30' }, start: DEFAULT_CALIBRATION_SET, maxEvaluations: 40 });
    expect(Math.abs(outcome.set.parameters.lapseRateCPerKm! - -5.2)).toBeLessThan(0.2);
    expect(outcome.result.scores!.kge).toBeGreaterThan(outcome.start.scores!.kge);
    expect(outcome.result.scores!.kge).toBeGreaterThan(0.98);
  }, 60_000);
  it('refuses a period holding fewer than two readings', () => {
    expect(() => calibrateToStakes(valley, measured, { keys: ['lapseRateCPerKm'], period: { from: '2021-10-01', to: '2022-03-01' }, start: DEFAULT_CALIBRATION_SET })).toThrow(/only 0 stake reading/);
  });
});
