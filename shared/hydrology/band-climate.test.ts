import { describe, expect, it } from 'vitest';
import { bandClimate, type ClimateBand } from './band-climate';
import { DRY_ADIABATIC_K_PER_M } from './glacier-air-temperature';
import type { PrecipitationProfile } from './precipitation-profile';

const bands: ClimateBand[] = [
  { lowerM: 2400, upperM: 3000, areaKm2: 12, glacierFraction: 0 },
  { lowerM: 3000, upperM: 4000, areaKm2: 20, glacierFraction: 0.2 },
  { lowerM: 4000, upperM: 5000, areaKm2: 15, glacierFraction: 0.6 },
];
const twelve = <T,>(v: T): T[] => Array.from({ length: 12 }, () => v);
const linear: PrecipitationProfile = { kind: 'linear', gradientPerKm: 0.4 };

describe('band climate from gradients', () => {
  it('offsets and multipliers at band mid-elevations, band-major (hand-worked: −6 K/km, +40 %/km, station at 2700 m)', () => {
    const c = bandClimate({ bands, referenceElevationM: 2700, lapseRatesKPerKm: twelve(-6), profiles: twelve(linear) });
    expect(c.bandCount).toBe(3);
    expect(c.temperatureOffsetK[0]).toBeCloseTo(0, 12);
    expect(c.temperatureOffsetK[1 * 12 + 5]).toBeCloseTo(-4.8, 12);
    expect(c.temperatureOffsetK[2 * 12 + 11]).toBeCloseTo(-10.8, 12);
    expect(c.precipitationMultiplier[2 * 12]).toBeCloseTo(1 + 0.4 * 1.8, 12);
    expect(Array.from(c.glacierTemperatureOffsetK)).toEqual(Array.from(c.temperatureOffsetK));
  });

  it('uses each month its own gradient', () => {
    const rates = twelve(-6);
    rates[0] = 2;
    const c = bandClimate({ bands, referenceElevationM: 2700, lapseRatesKPerKm: rates, profiles: twelve(linear) });
    expect(c.temperatureOffsetK[2 * 12 + 0]).toBeCloseTo(3.6, 12);
    expect(c.temperatureOffsetK[2 * 12 + 1]).toBeCloseTo(-10.8, 12);
  });

  it('refuses a peaked profile whose peak lies outside the bands, naming the month', () => {
    const profiles = twelve<PrecipitationProfile>(linear);
    profiles[3] = { kind: 'peaked', peakElevationM: 6000, gradientBelowPerKm: 0.2, decreaseAbovePerKm: 0.3 };
    expect(() => bandClimate({ bands, referenceElevationM: 2700, lapseRatesKPerKm: twelve(-6), profiles })).toThrow(/^profiles\[3\].peakElevationM: the precipitation peak at 6000 m lies outside the bands \(2400–5000 m\)/);
  });

  it('refuses eleven lapse rates and an implausible one', () => {
    expect(() => bandClimate({ bands, referenceElevationM: 2700, lapseRatesKPerKm: Array(11).fill(-6), profiles: twelve(linear) })).toThrow('lapseRatesKPerKm: 12 values are needed (one per month, January first); 11 were given.');
    const rates = twelve(-6);
    rates[7] = -40;
    expect(() => bandClimate({ bands, referenceElevationM: 2700, lapseRatesKPerKm: rates, profiles: twelve(linear) })).toThrow(/lapseRatesKPerKm\[7\]/);
  });

  describe('on-glacier damping (Greuell & Böhm 1998 form)', () => {
    const damping = { lengthScaleM: 5000, flowlineGradient: 0.15 };
    const warm = (tRef: number) => bandClimate({ bands, referenceElevationM: 2700, lapseRatesKPerKm: twelve(-6), profiles: twelve(linear), glacierDamping: { ...damping, referenceMonthlyTemperatureC: twelve(tRef) } });

    it('cools glacier bands below the free air in a warm month and matches T(x) = (T0 − Teq)e^(−x/L) + Teq', () => {
      const c = warm(15);
      const top = 5000;
      const z = 3500;
      const t0 = 15 - 6 * (top - 2700) / 1000;
      const teq = DRY_ADIABATIC_K_PER_M * 0.15 * 5000;
      const expected = (t0 - teq) * Math.exp(-((top - z) / 0.15) / 5000) + teq;
      expect(c.glacierTemperatureOffsetK[1 * 12]).toBeCloseTo(expected - 15, 12);
      expect(c.glacierTemperatureOffsetK[1 * 12]).toBeLessThan(c.temperatureOffsetK[1 * 12]);
      expect(c.glacierTemperatureOffsetK[0]).toBe(c.temperatureOffsetK[0]);
    });

    it('damps a warming of the free air by e^(−x/L) on the tongue', () => {
      const dGlacier = (warm(16).glacierTemperatureOffsetK[12] + 16) - (warm(15).glacierTemperatureOffsetK[12] + 15);
      expect(dGlacier).toBeCloseTo(Math.exp(-(1500 / 0.15) / 5000), 12);
    });

    it('leaves a cold month (free air at the glacier top below 0 °C) undamped', () => {
      const c = warm(5);
      expect(c.glacierTemperatureOffsetK[12]).toBe(c.temperatureOffsetK[12]);
    });

    it('refuses a damping length outside its range', () => {
      expect(() => bandClimate({ bands, referenceElevationM: 2700, lapseRatesKPerKm: twelve(-6), profiles: twelve(linear), glacierDamping: { lengthScaleM: 50, flowlineGradient: 0.15, referenceMonthlyTemperatureC: twelve(10) } })).toThrow(/glacierDamping.lengthScaleM/);
    });
  });
});
