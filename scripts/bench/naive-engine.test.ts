import { describe, expect, it } from 'vitest';
import { simulate } from '../../shared/melt/simulate';
import { inventedValley } from '../../shared/melt/fixtures/invented-valley';
import { simulateNaive } from './naive-engine';

/**
 * Differential test: the engine's loop (sun once per hour, band constants hoisted, nothing
 * allocated) gives what the naive loop gives (sun per band-hour, new records every step).
 */
describe('the engine loop against the naive loop', () => {
  const input = { ...inventedValley({ years: 2, bandCount: 5 }), period: { from: '2022-10-01', to: '2023-09-30' } };
  const engine = simulate(input);
  const naive = simulateNaive(input);
  it('covers the same days', () => expect(naive.length).toBe(engine.dayCount));
  it('agrees on runoff by source, pack water, snow cover and absorbed shortwave to 10⁻⁹', () => {
    let largest = 0;
    naive.forEach((bands, d) => bands.forEach((t, b) => {
      const i = b * engine.dayCount + d;
      const f = engine.bandDay;
      for (const [a, c] of [[t.snowRunoff, f.snowMeltMm[i]], [t.iceMelt, f.iceMeltMm[i]], [t.debrisMelt, f.debrisIceMeltMm[i]], [t.rainRunoff, f.rainMm[i]],
        [t.swe, f.sweMm[i]], [t.cover, f.snowCoverFraction[i]], [t.shortwaveAbsorbedWm2, f.absorbedShortwaveWm2[i]]]) largest = Math.max(largest, Math.abs(a - c));
    }));
    expect(largest).toBeLessThan(1e-9);
  });
});
