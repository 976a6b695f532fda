import { describe, expect, it } from 'vitest';
import { normalisedThinning } from './delta-h';
import { updateGlacier } from './glacier-update';
import { glacierVolumeKm3, glacierVolumeOf, initialGlacier, type GlacierBand } from './glacier-volume';

/** An invented 30 km² glacier over eight 250 m bands from 3500 to 5500 m. */
const bands: GlacierBand[] = Array.from({ length: 8 }, (_, i) => ({ lowerM: 3500 + 250 * i, upperM: 3750 + 250 * i, areaKm2: 10, glacierFraction: [0.2, 0.3, 0.4, 0.45, 0.45, 0.4, 0.4, 0.4][i] }));
const glacierKm2 = bands.reduce((s, b) => s + b.areaKm2 * b.glacierFraction, 0);

describe('initial glacier volume', () => {
  it('volume–area scaling (Bahr et al. 1997 form, c = 0.034, γ = 1.375 [memory]): 10 km² → 0.034·10^1.375 = 0.806 km³ [computed]', () => {
    expect(glacierVolumeKm3(10)).toBeCloseTo(0.8063, 4);
    const state = initialGlacier(bands);
    expect(glacierVolumeOf(state)).toBeCloseTo(glacierVolumeKm3(glacierKm2), 9);
    expect(new Set(Array.from(state.thicknessM).filter((h) => h > 0)).size).toBe(1);
  });

  it('several glaciers hold less ice than one of the same total area', () => {
    const parts = initialGlacier(bands, { glacierAreasKm2: [15, 10, 5] });
    expect(glacierVolumeOf(parts)).toBeCloseTo(glacierVolumeKm3(15) + glacierVolumeKm3(10) + glacierVolumeKm3(5), 9);
    expect(glacierVolumeOf(parts)).toBeLessThan(glacierVolumeOf(initialGlacier(bands)));
  });

  it('uses the ice thickness per band when given, and refuses bad thicknesses or areas that do not add up', () => {
    const thickness = [40, 60, 90, 120, 140, 120, 90, 60];
    const state = initialGlacier(bands, { iceThicknessM: thickness });
    expect(glacierVolumeOf(state)).toBeCloseTo(bands.reduce((s, b, i) => s + b.areaKm2 * b.glacierFraction * thickness[i], 0) / 1000, 12);
    expect(() => initialGlacier(bands, { iceThicknessM: [...thickness.slice(0, 7), -5] })).toThrow(/iceThicknessM\[7\]: an ice thickness of -5 m/);
    expect(() => initialGlacier(bands, { glacierAreasKm2: [10, 5] })).toThrow(/glacierAreasKm2: the glaciers add up to 15.00 km², but the bands hold 30.00 km²/);
  });
});

describe('annual glacier update (Δh-parameterisation, Huss et al. 2010)', () => {
  const start = initialGlacier(bands, { iceThicknessM: [40, 60, 90, 120, 140, 120, 90, 60] });
  const volumeM3 = (s: typeof start) => glacierVolumeOf(s) * 1e9;

  it.each([-2500, -800, -50, 300, 1200])('the volume change equals the mass balance (%i mm w.e.) to 1e-9: ΔV ρice = B A ρw', (balance) => {
    for (const areaRule of ['parabolic', 'constant'] as const) {
      const update = updateGlacier(bands, start, balance, { areaRule });
      const expected = (balance / 1000) * glacierKm2 * 1e6 * (1000 / 900);
      expect(Math.abs(update.volumeChangeM3 - expected)).toBeLessThan(1e-9 * Math.abs(expected));
      expect(Math.abs(volumeM3(update.state) - volumeM3(start) - expected)).toBeLessThan(1e-9 * Math.abs(expected));
    }
  });

  it('reproduces the normalised thinning curve: with the area fixed, thinning per band / largest thinning = Δh(hr)', () => {
    const update = updateGlacier(bands, start, -600, { areaRule: 'constant', sizeClass: 'large' });
    const thinning = Array.from(start.thicknessM, (h, i) => h - update.state.thicknessM[i]);
    const largest = Math.max(...thinning);
    bands.forEach((b, i) => {
      const hr = (5375 - (b.lowerM + 125)) / (5375 - 3625);
      expect(thinning[i] / largest).toBeCloseTo(normalisedThinning(hr, 'large'), 9);
    });
  });

  it('loss: the tongue thins most and loses area first; the glacier above keeps nearly all of its area', () => {
    const update = updateGlacier(bands, start, -1500);
    expect(update.sizeClass).toBe('large');
    expect(update.state.thicknessM[0]).toBeLessThan(start.thicknessM[0]);
    expect(update.state.areaKm2[0]).toBeLessThan(start.areaKm2[0]);
    expect(update.state.areaKm2[7]).toBeCloseTo(start.areaKm2[7], 6);
    expect(update.glacierFraction[0]).toBeCloseTo(update.state.areaKm2[0] / 10, 12);
  });

  it('repeated losses remove the lowest band first and finally the whole glacier, reporting the loss no ice was left for', () => {
    let state = start;
    let vanishedLowest = -1;
    for (let year = 0; year < 200 && glacierVolumeOf(state) > 0; year++) {
      const update = updateGlacier(bands, state, -3000);
      if (vanishedLowest < 0 && update.state.areaKm2[0] === 0) vanishedLowest = year;
      if (update.state.areaKm2[0] > 0) expect(update.state.areaKm2.slice(1).every((a) => a > 0)).toBe(true);
      state = update.state;
    }
    expect(vanishedLowest).toBeGreaterThan(0);
    expect(glacierVolumeOf(state)).toBe(0);
    const final = updateGlacier(bands, initialGlacier(bands, { iceThicknessM: Array(8).fill(1) }), -5000);
    expect(final.unsuppliedM3).toBeGreaterThan(0);
    expect(final.volumeChangeM3).toBeCloseTo(-glacierKm2 * 1e6, 0);
  });

  it('gain thickens and widens glacier bands up to the band area, never into bands without glacier', () => {
    const withBare = bands.map((b, i) => (i === 0 ? { ...b, glacierFraction: 0 } : b));
    const s = initialGlacier(withBare, { iceThicknessM: [0, 60, 90, 120, 140, 120, 90, 60] });
    const update = updateGlacier(withBare, s, 2000);
    expect(update.state.areaKm2[0]).toBe(0);
    for (let i = 1; i < 8; i++) {
      expect(update.state.thicknessM[i]).toBeGreaterThanOrEqual(s.thicknessM[i]);
      expect(update.state.areaKm2[i]).toBeLessThanOrEqual(10);
    }
  });

  it('refuses a balance that is not a number or beyond ±20 m w.e.', () => {
    expect(() => updateGlacier(bands, start, Number.NaN)).toThrow(/massBalanceMm: The glacier mass balance must be a number/);
    expect(() => updateGlacier(bands, start, -25000)).toThrow(/massBalanceMm/);
  });
});
