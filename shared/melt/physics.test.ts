import { describe, expect, it } from 'vitest';
import { debrisSurfaceTemperature } from './debris';
import { DEBRIS, stepDebris, type DebrisColumn } from './debris-layers';
import { STEFAN_BOLTZMANN } from './constants';
import { incomingLongwave } from './longwave';

describe('debris surface energy balance (Nicholson & Benn 2006 form)', () => {
  it('three Newton steps leave a residual below 10⁻³ W m⁻² across hot, cold, thin and thick cases', () => {
    for (const [sw, lw, ta, hc, k] of [[800, 300, 15, 8, 180], [0, 200, -20, 3, 1.8], [600, 280, 5, 10, 9], [50, 250, -5, 1, 90], [900, 330, 25, 12, 0.9]]) {
      const ts = debrisSurfaceTemperature(sw, lw, ta, hc, k, 0.95);
      const tk = ts + 273.15;
      const residual = sw + lw - 0.95 * STEFAN_BOLTZMANN * tk ** 4 + hc * (ta - ts) - k * ts;
      expect(Math.abs(residual)).toBeLessThan(1e-3);
    }
  });
  it('thicker debris runs a warmer surface and conducts less heat', () => {
    const flux = (h: number) => { const k = 0.9 / h; return k * debrisSurfaceTemperature(700, 300, 10, 8, k, 0.95); };
    expect(flux(0.05)).toBeGreaterThan(flux(0.2));
    expect(flux(0.2)).toBeGreaterThan(flux(0.5));
  });
});

describe('layered debris (three nodes with heat storage, after Reid & Brock 2010)', () => {
  const column: DebrisColumn = { thicknessM: 0.2, conductivity: 0.9, heatCapacity: 1.4e6, emissivity: 0.95, sensibleCoefficient: 8, drag: 0.007, heightOverRoughness: 125 };
  it('settles under steady weather to the steady surface temperature of Nicholson & Benn 2006 (within 0.05 K)', () => {
    const out = new Float64Array(8);
    let t = [0, 0, 0];
    for (let h = 0; h < 24 * 30; h++) {
      stepDebris(out, column, 600, 300, 10, 2, t[0], t[1], t[2], false);
      t = [out[DEBRIS.surfaceC], out[DEBRIS.upperC], out[DEBRIS.lowerC]];
    }
    const steady = debrisSurfaceTemperature(600, 300, 10, 8, 0.9 / 0.2, 0.95);
    expect(Math.abs(t[0] - steady)).toBeLessThan(0.05);
    expect(out[DEBRIS.conducted]).toBeCloseTo((0.9 / 0.2) * steady, 1);
  });
  it('stores heat: the first sunny hour on cold debris warms it without melting ice', () => {
    const out = new Float64Array(8);
    stepDebris(out, column, 700, 280, 5, 2, -5, -5, -5, true);
    expect(out[DEBRIS.surfaceC]).toBeGreaterThan(-5);
    expect(out[DEBRIS.melt]).toBe(0);
  });
});

describe('incoming longwave (Brutsaert 1975; Konzelmann et al. 1994)', () => {
  it('rises with temperature, humidity and cloud', () => {
    expect(incomingLongwave(5, 0.7, 0.3)).toBeGreaterThan(incomingLongwave(0, 0.7, 0.3));
    expect(incomingLongwave(0, 0.9, 0.3)).toBeGreaterThan(incomingLongwave(0, 0.5, 0.3));
    expect(incomingLongwave(0, 0.7, 1)).toBeGreaterThan(incomingLongwave(0, 0.7, 0));
  });
  it('overcast sky emits 0.952 σT⁴', () => {
    expect(incomingLongwave(0, 0.7, 1)).toBeCloseTo(0.952 * STEFAN_BOLTZMANN * 273.15 ** 4, 9);
  });
});
