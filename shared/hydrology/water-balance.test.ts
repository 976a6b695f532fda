import { describe, expect, it } from 'vitest';
import { seededRandom } from '../analysis/random';
import { precipitationMultiplier } from './precipitation-profile';
import { invertWaterBalance, WaterBalanceNotClosedError, type BalanceCandidate, type ModelledBalance } from './water-balance';

/**
 * A synthetic catchment whose water balance is known exactly (invented numbers): eight bands,
 * glaciers in the upper ones, a valley station at 2500 m with 400 mm a year, fixed evaporation and
 * sublimation, glacier ablation rising below 5200 m. Non-glacier ground stores nothing over the year.
 */
const mids = [2750, 3250, 3750, 4250, 4750, 5250, 5750, 6250];
const bands = mids.map((z) => ({ lowerM: z - 250, upperM: z + 250, areaKm2: 0 })).map((b, i) => ({ ...b, areaKm2: [20, 25, 30, 30, 25, 20, 10, 5][i] }));
const glacierFraction = [0, 0, 0.05, 0.2, 0.4, 0.6, 0.8, 0.9];
const STATION_MM = 400;
let calls = 0;
function evaluate(c: BalanceCandidate): ModelledBalance {
  calls++;
  const area = bands.reduce((s, b) => s + b.areaKm2, 0);
  let p = 0, e = 0, ice = 0, glacierArea = 0;
  const bandPrecipitationMm = new Float64Array(bands.length);
  const bandGlacierBalanceMm = new Float64Array(bands.length);
  bands.forEach((b, i) => {
    const z = mids[i];
    const pb = STATION_MM * c.precipitationFactor * precipitationMultiplier(c.profile, z, 2500);
    const eb = Math.max(50, 300 - 0.05 * (z - 2500));
    const balance = pb - eb - Math.max(0, 0.9 * (5200 - z));
    bandPrecipitationMm[i] = pb;
    bandGlacierBalanceMm[i] = balance;
    p += pb * b.areaKm2;
    e += eb * b.areaKm2;
    ice += balance * b.areaKm2 * glacierFraction[i];
    glacierArea += b.areaKm2 * glacierFraction[i];
  });
  return {
    precipitationMm: p / area,
    evaporationSublimationMm: e / area,
    snowStorageChangeMm: 0,
    iceStorageChangeMm: ice / area,
    runoffMm: (p - e - ice) / area,
    glacierMassBalanceMm: ice / glacierArea,
    bandGlacierBalanceMm,
    bandPrecipitationMm,
  };
}

const truth: BalanceCandidate = { precipitationFactor: 2.2, profile: { kind: 'peaked', peakElevationM: 5100, gradientBelowPerKm: 0.5, decreaseAbovePerKm: 0.4 } };
const station: BalanceCandidate = { precipitationFactor: 1, profile: { kind: 'peaked', peakElevationM: 4200, gradientBelowPerKm: 0.5, decreaseAbovePerKm: 0.4 } };
const truthModel = evaluate(truth);
const runoffSigma = 0.05 * truthModel.runoffMm;
const glacierSigma = 150;

describe('water-balance inversion on synthetic truth', () => {
  it('recovers the known precipitation factor and peak elevation from exact runoff and glacier balance', () => {
    const result = invertWaterBalance({
      observations: { runoffMm: { value: truthModel.runoffMm, uncertainty: runoffSigma }, glacierMassBalanceMm: { value: truthModel.glacierMassBalanceMm!, uncertainty: glacierSigma } },
      evaluate, station, unknowns: ['precipitationFactor', 'peakElevationM'], bands,
    });
    if (result.candidate.profile.kind !== 'peaked') throw new Error('expected a peaked profile');
    expect(result.candidate.precipitationFactor).toBeCloseTo(2.2, 3);
    expect(result.candidate.profile.peakElevationM).toBeCloseTo(5100, 0);
    expect(result.uncertainty.precipitationFactor).toBeGreaterThan(0);
    expect(result.uncertainty.peakElevationM).toBeGreaterThan(0);
    // The balance terms add up (the synthetic model conserves mass) and the measured runoff is met.
    expect(Math.abs(result.balance.closureMm)).toBeLessThan(1e-3 * runoffSigma);
    expect(result.balance.modelledRunoffMm).toBeCloseTo(truthModel.runoffMm, 2);
    expect(result.precipitationRatio.value).toBeCloseTo(truthModel.precipitationMm / evaluate(station).precipitationMm, 4);
    expect(result.precipitationRatio.uncertainty).toBeGreaterThan(0);
  });

  it('stated uncertainties cover the truth: with observations perturbed by their σ, ≥ 80 % of 30 inversions lie within 2σ (≈ 95 % expected)', () => {
    const random = seededRandom(14);
    const gauss = () => Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
    let factorInside = 0, peakInside = 0;
    const trials = 30;
    for (let t = 0; t < trials; t++) {
      const result = invertWaterBalance({
        observations: {
          runoffMm: { value: truthModel.runoffMm + runoffSigma * gauss(), uncertainty: runoffSigma },
          glacierMassBalanceMm: { value: truthModel.glacierMassBalanceMm! + glacierSigma * gauss(), uncertainty: glacierSigma },
        },
        evaluate, station, unknowns: ['precipitationFactor', 'peakElevationM'], bands,
      });
      if (result.candidate.profile.kind !== 'peaked') throw new Error('expected a peaked profile');
      if (Math.abs(result.candidate.precipitationFactor - 2.2) <= 2 * result.uncertainty.precipitationFactor!) factorInside++;
      if (Math.abs(result.candidate.profile.peakElevationM - 5100) <= 2 * result.uncertainty.peakElevationM!) peakInside++;
    }
    expect(factorInside).toBeGreaterThanOrEqual(0.8 * trials);
    expect(peakInside).toBeGreaterThanOrEqual(0.8 * trials);
  });

  it('runoff alone closes the balance for the factor; the uncertainty follows the runoff accuracy', () => {
    const linear: BalanceCandidate = { precipitationFactor: 1, profile: { kind: 'linear', gradientPerKm: 0.3 } };
    const target = evaluate({ ...linear, precipitationFactor: 3 });
    const result = invertWaterBalance({ observations: { runoffMm: { value: target.runoffMm, uncertainty: 40 } }, evaluate, station: linear, unknowns: ['precipitationFactor'], bands });
    expect(result.candidate.precipitationFactor).toBeCloseTo(3, 4);
    // Runoff is linear in the factor here: σ_f = σ_R / (∂R/∂f) = 40 / (R(f = 2) − R(f = 1)) [computed].
    const slope = evaluate({ ...linear, precipitationFactor: 2 }).runoffMm - evaluate(linear).runoffMm;
    expect(result.uncertainty.precipitationFactor).toBeCloseTo(40 / slope, 4);
    expect(result.stationBalance.precipitationMm).toBeCloseTo(evaluate(linear).precipitationMm, 9);
  });

  it('uses few model runs: under 40 for two unknowns', () => {
    calls = 0;
    invertWaterBalance({
      observations: { runoffMm: { value: truthModel.runoffMm, uncertainty: runoffSigma }, glacierMassBalanceMm: { value: truthModel.glacierMassBalanceMm!, uncertainty: glacierSigma } },
      evaluate, station, unknowns: ['precipitationFactor', 'peakElevationM'], bands,
    });
    expect(calls).toBeLessThan(40);
  });
});

describe('water-balance inversion refusals', () => {
  const observations = { runoffMm: { value: 900, uncertainty: 45 } };

  it('an inversion that cannot close says which observation, which bound and by how much', () => {
    try {
      invertWaterBalance({ observations: { runoffMm: { value: 20000, uncertainty: 500 } }, evaluate, station, unknowns: ['precipitationFactor'], bands });
      throw new Error('expected a refusal');
    } catch (error) {
      expect(error).toBeInstanceOf(WaterBalanceNotClosedError);
      const e = error as WaterBalanceNotClosedError;
      expect(e.issues[0].path).toBe('observations.runoffMm');
      expect(e.issues[0].message).toMatch(/^The water balance cannot be closed: even with the precipitation factor at its upper bound \(6\.00\), the modelled runoff \(\d+ mm\) stays below the measured 20000 ± 500 mm/);
      expect(e.nearest.candidate.precipitationFactor).toBe(6);
    }
  });

  it('more unknowns than observations are refused with the way out', () => {
    expect(() => invertWaterBalance({ observations, evaluate, station, unknowns: ['precipitationFactor', 'peakElevationM'], bands }))
      .toThrow(/unknowns: 2 unknowns \(precipitation factor, peak elevation\) need at least 2 observations; there is only the runoff. Add a glacier mass balance/);
  });

  it('refuses a runoff without a stated accuracy, an unknown foreign to the profile and a missing band', () => {
    expect(() => invertWaterBalance({ observations: { runoffMm: { value: 900, uncertainty: 0 } }, evaluate, station, unknowns: ['precipitationFactor'], bands }))
      .toThrow(/observations.runoffMm.uncertainty: the measured runoff needs a stated accuracy greater than 0/);
    expect(() => invertWaterBalance({ observations, evaluate, station, unknowns: ['gradientPerKm'], bands })).toThrow(/unknowns\[0\]: the precipitation gradient is not part of a peaked profile/);
    expect(() => invertWaterBalance({ observations: { ...observations, bandBalances: [{ band: 8, value: -500, uncertainty: 200 }] }, evaluate, station, unknowns: ['precipitationFactor'], bands }))
      .toThrow(/observations.bandBalances\[0\].band: band 8 does not exist/);
  });

  it('refuses a glacier observation when the model gives no glacier balance', () => {
    const noGlacier = (c: BalanceCandidate) => ({ ...evaluate(c), glacierMassBalanceMm: undefined });
    expect(() => invertWaterBalance({ observations: { ...observations, glacierMassBalanceMm: { value: -400, uncertainty: 200 } }, evaluate: noGlacier, station, unknowns: ['precipitationFactor'], bands }))
      .toThrow(/observations.glacierMassBalanceMm: the model gives no glacier mass balance/);
  });
});

describe('band balances from stakes', () => {
  it('two stake bands and the runoff determine factor, peak and gradient below', () => {
    const result = invertWaterBalance({
      observations: {
        runoffMm: { value: truthModel.runoffMm, uncertainty: runoffSigma },
        bandBalances: [4, 6].map((band) => ({ band, value: truthModel.bandGlacierBalanceMm![band], uncertainty: 100 })),
      },
      evaluate, station, unknowns: ['precipitationFactor', 'peakElevationM', 'gradientBelowPerKm'], bands,
    });
    if (result.candidate.profile.kind !== 'peaked') throw new Error('expected a peaked profile');
    expect(result.candidate.precipitationFactor).toBeCloseTo(2.2, 2);
    expect(result.candidate.profile.peakElevationM).toBeCloseTo(5100, -1);
    expect(result.candidate.profile.gradientBelowPerKm).toBeCloseTo(0.5, 3);
  });
});
