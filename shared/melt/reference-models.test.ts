import { describe, expect, it } from 'vitest';
import { simulateDegreeDay, simulateEnhancedTemperatureIndex } from './simulate';
import { steadyClimate } from './fixtures/steady-climate';
import { DEFAULT_PARAMETERS } from './parameters';

// Hand-checkable cases: constant 5 °C at the band (no lapse offset, no daily range), no snow,
// half the glacier under debris exactly H* = 6.6 cm thick, so debris melt is half of clean melt.
const input = steadyClimate({ days: 3, meanC: 5, rangeC: 0, bands: [{ debrisFraction: 0.5, debrisThicknessM: 0.066 }] });

describe('degree-day model (Hock 2003; Braithwaite 1995; Anderson & Anderson 2016)', () => {
  const r = simulateDegreeDay(input);
  it('clean ice melts DDF_ice × T = 8 × 5 = 40 mm w.e. per day', () => {
    expect(r.bandDay.iceMeltMm[0] / 0.5).toBeCloseTo(DEFAULT_PARAMETERS.degreeDayIce * 5, 9);
  });
  it('debris at h = H* halves it', () => {
    expect(r.bandDay.debrisIceMeltMm[0] / 0.5).toBeCloseTo(DEFAULT_PARAMETERS.degreeDayIce * 5 * 0.5, 9);
  });
  it('snow melts DDF_snow × T per day at the surface, and drains once the pack holds all it can', () => {
    const snowy = simulateDegreeDay({ ...input, initialState: { sweMm: [500] } });
    expect(snowy.bandDay.surfaceMeltMm[0]).toBeCloseTo(DEFAULT_PARAMETERS.degreeDaySnow * 5, 9);
    expect(snowy.bandTotals.snowMeltMm[0]).toBeLessThan(snowy.bandTotals.surfaceMeltMm[0]);
  });
});

describe('enhanced temperature-index model (Pellicciotti et al. 2005)', () => {
  const r = simulateEnhancedTemperatureIndex(input);
  it('clean ice melts TF·T·24 + SRF·(1 − α)·ΣG per day', () => {
    const dailyShortwaveWh = r.bandDay.incomingShortwaveWm2[0] * 24;
    const expected = 0.05 * 5 * 24 + 0.0094 * (1 - DEFAULT_PARAMETERS.iceAlbedo) * dailyShortwaveWh;
    expect(r.bandDay.iceMeltMm[0] / 0.5).toBeCloseTo(expected, 6);
  });
  it('nothing melts at or below the threshold temperature', () => {
    const cold = simulateEnhancedTemperatureIndex(steadyClimate({ days: 2, meanC: 1, rangeC: 0 }));
    expect(cold.bandTotals.iceMeltMm[0]).toBe(0);
  });
});
