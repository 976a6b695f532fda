import { describe, expect, it } from 'vitest';
import { inventedValley } from '../melt/fixtures/invented-valley';
import { addDays } from '../melt/calendar';
import { calibrate, evaluateDischarge, simulateDischarge, splitSample } from './calibrate';
import { DEFAULT_CALIBRATION_SET, siteWith, type CalibrationSet } from './calibration-set';

// A synthetic case with known truth: discharge simulated with these parameters is the
// "observed" record; the search starts from the engine's defaults and must find them again.
const valley = inventedValley({ bandCount: 6, timeStep: 'daily', years: 2 });
const truth: CalibrationSet = { parameters: { lapseRateCPerKm: -5.4, iceAlbedo: 0.3 }, precipitationFactor: 1.25 };
const season2022 = { from: '2022-04-01', to: '2022-09-30' };
const season2023 = { from: '2023-04-01', to: '2023-09-30' };
// Each season's record is simulated as the calibration simulates it (spun up through the record before it).
const observed = [season2022, season2023].flatMap((season) => {
  const record = simulateDischarge(siteWith(valley, truth), season);
  return Array.from(record.values, (value, d) => ({ date: addDays(record.startDate, d), value }));
});
const keys = ['lapseRateCPerKm', 'iceAlbedo', 'precipitationFactor'] as const;

describe('automatic calibration on a synthetic case with known parameters', () => {
  const outcome = splitSample(valley, observed, { keys, period: season2022, validationPeriod: season2023, start: DEFAULT_CALIBRATION_SET, maxEvaluations: 150, seed: 3 });
  const { calibration } = outcome;

  it('improves the daily KGE from the defaults to nearly 1', () => {
    expect(calibration.startScores.daily.kge).toBeLessThan(0.8);
    expect(calibration.scores.daily.kge).toBeGreaterThan(0.99);
  });
  it('recovers the true parameters within the stated tolerance (lapse rate ±0.2 °C/km, bare-ice albedo ±0.02, precipitation factor ±0.04)', () => {
    expect(Math.abs(calibration.set.parameters.lapseRateCPerKm! - -5.4)).toBeLessThan(0.2);
    expect(Math.abs(calibration.set.parameters.iceAlbedo! - 0.3)).toBeLessThan(0.02);
    expect(Math.abs(calibration.set.precipitationFactor - 1.25)).toBeLessThan(0.04);
  });
  it('scores better on the validation season it never saw', () => {
    expect(outcome.validationAfter.daily.kge).toBeGreaterThan(outcome.validationBefore.daily.kge);
    expect(outcome.validationAfter.daily.kge).toBeGreaterThan(0.95);
    expect(outcome.validationAfter.series.dates[0]).toBe('2023-04-01');
  });
  it('reports the scores of the truth as perfect (daily and monthly)', () => {
    const perfect = evaluateDischarge(siteWith(valley, truth), observed, season2022);
    expect(perfect.daily.kge).toBeCloseTo(1, 10);
    expect(perfect.daily.nse).toBeCloseTo(1, 10);
    expect(perfect.monthly!.kge).toBeCloseTo(1, 10);
    expect(perfect.monthly!.count).toBe(6);
    expect(perfect.daily.count).toBe(183);
  });
});

describe('calibration limits', () => {
  it('stops when cancelled', () => {
    const controller = new AbortController();
    const run = () => calibrate(valley, observed, {
      keys: ['lapseRateCPerKm'], period: season2022, start: DEFAULT_CALIBRATION_SET,
      signal: controller.signal, onProgress: (p) => { if (p.evaluations === 3) controller.abort(new Error('cancelled')); },
    });
    expect(run).toThrow('cancelled');
  });
  it('refuses more than four parameters and periods without observations', () => {
    expect(() => calibrate(valley, observed, { keys: ['lapseRateCPerKm', 'turbidity', 'iceAlbedo', 'debrisAlbedo', 'precipitationFactor'], period: season2022, start: DEFAULT_CALIBRATION_SET })).toThrow(/one to four/);
    expect(() => evaluateDischarge(valley, observed.slice(183), season2022)).toThrow(/only 0 observed day/);
  });
});
