import { describe, expect, it } from 'vitest';
import { seededRandom } from '../analysis/random';
import { fitLinearProfile, fitPeakedProfile, fittedPrecipitationMm } from './precipitation-fit';
import { precipitationMultiplier, type PrecipitationProfile } from './precipitation-profile';

const truth: PrecipitationProfile = { kind: 'peaked', peakElevationM: 4800, gradientBelowPerKm: 0.5, decreaseAbovePerKm: 0.4 };
const REFERENCE_M = 2200;

/** Stations sampled from the known profile (500 mm at 2200 m, 1150 mm at the peak) with seeded 3 % (1σ) noise. */
function noisyStations(elevations: number[], seed: number, noise = 0.03) {
  const random = seededRandom(seed);
  const gauss = () => Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
  return elevations.map((z) => ({ elevationM: z, precipitationMm: 500 * precipitationMultiplier(truth, z, REFERENCE_M) * (1 + noise * gauss()) }));
}

describe('linear precipitation profile fit', () => {
  it('two stations: 400 mm at 2000 m, 600 mm at 3000 m → +50 % per km relative to the reference (hand-worked)', () => {
    const fit = fitLinearProfile([{ elevationM: 2000, precipitationMm: 400 }, { elevationM: 3000, precipitationMm: 600 }], 2000, 0.5, 's');
    expect(fit.profile).toEqual({ kind: 'linear', gradientPerKm: expect.closeTo(0.5, 12) });
    expect(fit.referencePrecipitationMm).toBeCloseTo(400, 9);
    expect(fit.standardErrors.gradientPerKm).toBeNull();
  });
  it('one station: assumed, not fitted', () => {
    const fit = fitLinearProfile([{ elevationM: 2000, precipitationMm: 400 }], 2000, 0.3, 's');
    expect(fit).toMatchObject({ status: 'assumed', profile: { kind: 'linear', gradientPerKm: 0.3 } });
    expect(fit.notes[0]).toMatch(/^Assumed, not fitted/);
  });
});

describe('peaked precipitation profile fit', () => {
  const elevations = [2200, 2800, 3300, 3900, 4300, 4700, 5100, 5500, 5900, 6300];

  it('noise-free stations reproduce the known profile exactly', () => {
    const fit = fitPeakedProfile(noisyStations(elevations, 1, 0), REFERENCE_M, {}, 's');
    expect(fit.profile.kind).toBe('peaked');
    if (fit.profile.kind !== 'peaked') return;
    expect(fit.profile.peakElevationM).toBeCloseTo(4800, 0);
    expect(fit.profile.gradientBelowPerKm).toBeCloseTo(0.5, 5);
    expect(fit.profile.decreaseAbovePerKm).toBeCloseTo(0.4, 5);
    expect(fit.r2).toBeCloseTo(1, 9);
  });

  it('noisy stations (3 %, five seeds) give the known profile back within 3 standard errors, the peak within 300 m', () => {
    for (const seed of [1, 2, 3, 4, 5]) {
      const fit = fitPeakedProfile(noisyStations(elevations, seed), REFERENCE_M, {}, 's');
      if (fit.profile.kind !== 'peaked') throw new Error('expected a peaked fit');
      const se = fit.standardErrors;
      expect(Math.abs(fit.profile.peakElevationM - 4800)).toBeLessThan(Math.max(300, 3 * se.peakElevationM!));
      expect(Math.abs(fit.profile.gradientBelowPerKm - 0.5)).toBeLessThan(3 * se.gradientBelowPerKm!);
      expect(Math.abs(fit.profile.decreaseAbovePerKm - 0.4)).toBeLessThan(3 * se.decreaseAbovePerKm!);
      expect(Math.abs(fittedPrecipitationMm(fit, 4800, REFERENCE_M) - 1150) / 1150).toBeLessThan(0.06);
    }
  });

  it('with the decrease above fixed, fewer stations suffice; fewer than the parameters are refused', () => {
    const three = noisyStations([2500, 4000, 5500], 7, 0);
    expect(() => fitPeakedProfile(three, REFERENCE_M, {}, 'stations')).toThrow(/stations: the peaked profile has 4 parameters to fit .* needs at least 4 stations; there are 3/);
    const fit = fitPeakedProfile(three, REFERENCE_M, { decreaseAbovePerKm: 0.4 }, 'stations');
    if (fit.profile.kind !== 'peaked') throw new Error('expected a peaked fit');
    expect(fit.profile.peakElevationM).toBeCloseTo(4800, 0);
    expect(fit.standardErrors.peakElevationM).toBeNull();
  });

  it('a fixed peak above every station cannot give the decrease above it: a clear message', () => {
    expect(() => fitPeakedProfile(noisyStations([2200, 2800, 3300, 3900], 3), REFERENCE_M, { peakElevationM: 5000 }, 'stations'))
      .toThrow(/stations: these stations \(2200–3900 m\) do not determine the peaked profile/);
  });

  it('stations that only rise put the peak at the highest station and say it may lie beyond', () => {
    const fit = fitPeakedProfile(noisyStations([2200, 2800, 3300, 3900, 4400], 4, 0), REFERENCE_M, { decreaseAbovePerKm: 0.3 }, 's');
    expect(fit.notes.join(' ')).toMatch(/may lie beyond the stations/);
  });
});
