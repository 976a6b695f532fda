import { describe, expect, it } from 'vitest';
import { inventedValley } from '../melt/fixtures/invented-valley';
import { simulate } from '../melt/simulate';
import { bandWaterBalance } from '../melt/water-balance';
import { NO_WATER_SIDE } from '../analysis/water-side-inputs';
import type { BalanceCandidate } from '../hydrology/water-balance';
import { balanceEvaluator, closeWaterBalance, modelledBalance } from './water-balance-closure';
import { catchmentInput } from './calibration-set';
import type { LabSite } from './site';

/**
 * The water-balance closure on synthetic truth made by the engine itself: an invented valley
 * (eight bands, glaciers above the middle) simulated with a hidden precipitation factor and
 * profile; its runoff and band glacier balances, with stated accuracies, are what the closure is
 * given. It must find the hidden values again within its stated uncertainty (2σ).
 */
const valley = inventedValley({ years: 2, bandCount: 8, timeStep: 'daily', seed: 5 });
const period = { from: '2022-10-01', to: '2023-09-30' };
const site: LabSite = { catchment: valley.catchment, forcing: valley.forcing, parameters: {}, precipitationFactor: 1, water: NO_WATER_SIDE };
const evaluate = balanceEvaluator(site, period);
const glacierBands = valley.catchment.bands.flatMap((b, i) => (b.glacierFraction > 0.2 ? [i] : []));

function observationsOf(truth: BalanceCandidate, runoffShare: number, stakeMm: number) {
  const t = evaluate(truth);
  return {
    runoffMm: { value: t.runoffMm, uncertainty: runoffShare * t.runoffMm },
    bandBalances: glacierBands.map((band) => ({ band, value: t.bandGlacierBalanceMm![band], uncertainty: stakeMm })),
  };
}
const observed = (o: ReturnType<typeof observationsOf>) => ({
  runoff: { ...o.runoffMm, days: 365, filledDays: 0, source: 'synthetic' },
  bandBalances: o.bandBalances.map((b) => ({ ...b, midM: 0, stakes: 1 })),
});

describe('the catchment water balance from one engine run', () => {
  it('closes: precipitation − evaporation − storage changes = runoff, with routing stores counted', () => {
    const r = simulate(catchmentInput({ ...site, water: { ...NO_WATER_SIDE, routing: { parameters: {} } } }, period));
    const m = modelledBalance(r, valley.catchment.bands.map((b) => b.glacierFraction));
    const left = m.precipitationMm - m.evaporationSublimationMm - m.snowStorageChangeMm - m.iceStorageChangeMm - m.storesChangeMm! - m.runoffMm;
    expect(Math.abs(left)).toBeLessThan(1e-6 * m.precipitationMm);
    expect(m.storesChangeMm).not.toBe(0);
    // The band balances behind it close too (shared/melt/water-balance.ts).
    expect(Math.abs(bandWaterBalance(r, 3).residualMm)).toBeLessThan(1e-9 * bandWaterBalance(r, 3).precipitationMm);
  });
});

describe('closing the water balance on synthetic truth', () => {
  it('recovers a hidden precipitation factor and gradient from runoff and stake balances', () => {
    const truth: BalanceCandidate = { precipitationFactor: 1.8, profile: { kind: 'linear', gradientPerKm: 0.9 } };
    const o = observationsOf(truth, 0.05, 150);
    const c = closeWaterBalance(site, {
      period, form: 'linear', unknowns: ['precipitationFactor', 'gradientPerKm'], observations: o, observed: observed(o),
      station: { precipitationFactor: 1, profile: { kind: 'linear', gradientPerKm: 0.3 } },
    });
    expect(c.closed).toBe(true);
    expect(Math.abs(c.candidate.precipitationFactor - 1.8)).toBeLessThan(2 * c.uncertainty.precipitationFactor!);
    if (c.candidate.profile.kind !== 'linear') throw new Error('expected a linear profile');
    expect(Math.abs(c.candidate.profile.gradientPerKm - 0.9)).toBeLessThan(2 * c.uncertainty.gradientPerKm!);
    expect(c.precipitationRatio.value).toBeGreaterThan(1.5);
    expect(c.bands.every((b) => b.inferredPrecipitationMm > b.stationPrecipitationMm)).toBe(true);
  }, 60_000);

  it('recovers a hidden peak elevation with the factor', () => {
    const truth: BalanceCandidate = { precipitationFactor: 1.5, profile: { kind: 'peaked', peakElevationM: 3400, gradientBelowPerKm: 1, decreaseAbovePerKm: 0.6 } };
    const o = observationsOf(truth, 0.03, 100);
    const c = closeWaterBalance(site, {
      period, form: 'peaked', unknowns: ['precipitationFactor', 'peakElevationM'], observations: o, observed: observed(o),
      station: { precipitationFactor: 1, profile: { kind: 'peaked', peakElevationM: 3900, gradientBelowPerKm: 1, decreaseAbovePerKm: 0.6 } },
    });
    expect(c.closed).toBe(true);
    if (c.candidate.profile.kind !== 'peaked') throw new Error('expected a peaked profile');
    expect(Math.abs(c.candidate.profile.peakElevationM - 3400)).toBeLessThan(Math.max(2 * (c.uncertainty.peakElevationM ?? 0), 25));
    expect(Math.abs(c.candidate.precipitationFactor - 1.5)).toBeLessThan(2 * c.uncertainty.precipitationFactor!);
  }, 60_000);

  it('says why a balance cannot close, and keeps its nearest attempt', () => {
    const o = observationsOf({ precipitationFactor: 1, profile: { kind: 'linear', gradientPerKm: 0.5 } }, 0.02, 150);
    const impossible = { ...o, runoffMm: { value: o.runoffMm.value * 20, uncertainty: o.runoffMm.uncertainty } };
    const c = closeWaterBalance(site, {
      period, form: 'linear', unknowns: ['precipitationFactor'], observations: { runoffMm: impossible.runoffMm }, observed: observed(impossible),
      station: { precipitationFactor: 1, profile: { kind: 'linear', gradientPerKm: 0.5 } },
    });
    expect(c.closed).toBe(false);
    expect(c.messages[0]).toMatch(/cannot be closed: even with the precipitation factor at its upper bound \(6\.00\)/);
    expect(c.candidate.precipitationFactor).toBeCloseTo(6, 2);
  }, 60_000);
});
