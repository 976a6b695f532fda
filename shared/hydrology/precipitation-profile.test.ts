import { describe, expect, it } from 'vitest';
import { checkProfile, precipitationMultiplier, type PrecipitationProfile } from './precipitation-profile';

const bands = [{ lowerM: 2400, upperM: 3400, areaKm2: 10 }, { lowerM: 3400, upperM: 5900, areaKm2: 20 }];
const peaked: PrecipitationProfile = { kind: 'peaked', peakElevationM: 5000, gradientBelowPerKm: 0.5, decreaseAbovePerKm: 0.5 };

describe('precipitation profiles (hand-worked from the profile definitions)', () => {
  it('linear: 1 + g Δz, the engine form: +50 % per km at 1 km above the station, floored at 0 far below', () => {
    expect(precipitationMultiplier({ kind: 'linear', gradientPerKm: 0.5 }, 3000, 2000)).toBeCloseTo(1.5, 12);
    expect(precipitationMultiplier({ kind: 'linear', gradientPerKm: 0.5 }, 0, 2500)).toBe(0);
  });

  it('peaked: +50 % per km from the station at 3000 m to the peak at 5000 m (2×), then −50 % of the peak per km (1× at 6000 m)', () => {
    expect(precipitationMultiplier(peaked, 5000, 3000)).toBeCloseTo(2, 12);
    expect(precipitationMultiplier(peaked, 6000, 3000)).toBeCloseTo(1, 12);
    expect(precipitationMultiplier(peaked, 4000, 3000)).toBeCloseTo(1.5, 12);
    expect(precipitationMultiplier(peaked, 3000, 3000)).toBe(1);
  });

  it('a station above the peak: the multiplier is still 1 there and the peak the wettest', () => {
    expect(precipitationMultiplier(peaked, 5500, 5500)).toBe(1);
    expect(precipitationMultiplier(peaked, 5000, 5500)).toBeCloseTo(1 / 0.75, 12);
  });

  it('the profile rises to the peak and falls above it', () => {
    const values = [3000, 4000, 4500, 5000, 5500, 6000].map((z) => precipitationMultiplier(peaked, z, 3000));
    expect(values.slice(0, 4)).toEqual([...values.slice(0, 4)].sort((a, b) => a - b));
    expect(values[4]).toBeLessThan(values[3]);
    expect(values[5]).toBeLessThan(values[4]);
  });

  it('refuses a peak outside the bands, naming the field and the bands', () => {
    expect(() => checkProfile({ ...peaked, peakElevationM: 6500 }, bands, 3000, 'profiles[6]')).toThrow('profiles[6].peakElevationM: the precipitation peak at 6500 m lies outside the bands (2400–5900 m).');
  });

  it('refuses a gradient outside its range and a shape dry at the reference station', () => {
    expect(() => checkProfile({ ...peaked, gradientBelowPerKm: 5 }, bands, 3000, 'p')).toThrow(/p.gradientBelowPerKm: The gradient below the peak is 5 per km/);
    expect(() => checkProfile({ ...peaked, peakElevationM: 2500, decreaseAbovePerKm: 0.8 }, bands, 4000, 'p')).toThrow(/p.decreaseAbovePerKm: with this decrease above the peak the profile gives no precipitation at the reference station/);
    expect(() => checkProfile({ kind: 'linear', gradientPerKm: 5 }, bands, 3000, 'p')).toThrow(/p.gradientPerKm/);
  });
});
