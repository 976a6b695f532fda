import { describe, expect, it } from 'vitest';
import { debrisSurfaceTemperature } from './debris';
import { spendSurplus } from './energy';
import { clearSkyBeam, extraterrestrialNormal, slopeIrradiance } from './shortwave';
import { clearSkyDaily } from './fao56';
import { solarPosition } from './solar-position';
import { sunGeometry } from './sun-track';
import { pressureAt } from './pressure';
import { STEFAN_BOLTZMANN, SEA_LEVEL_PRESSURE_PA, SPECIFIC_HEAT_ICE } from './constants';
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

describe('cold content (energy bookkeeping of spendSurplus)', () => {
  it('melt energy equals the positive surplus once the cold content is repaid', () => {
    const cc = new Float64Array(1);
    expect(spendSurplus(-100, cc, 0, 500, -10)).toBe(0); // 360 kJ m⁻² of cold content, below the cap 2097·500·10
    expect(cc[0]).toBeCloseTo(360_000, 6);
    expect(spendSurplus(60, cc, 0, 500, 2)).toBe(0);
    expect(spendSurplus(300, cc, 0, 500, 2)).toBeCloseTo(300 * 3600 - (360_000 - 60 * 3600), 6);
    expect(cc[0]).toBe(0);
  });
  it('the surface cools no further than the air: cold content stops at c_ice · mass · (0 − Ta)', () => {
    const cc = new Float64Array(1);
    spendSurplus(-1000, cc, 0, 10, -1);
    expect(cc[0]).toBeCloseTo(SPECIFIC_HEAT_ICE * 10, 6);
  });
});

describe('hourly clear-sky model summed over a day against FAO-56 Rso', () => {
  // SCIENCE.md: the hourly model (Hock 1999, ψ = 0.75, diffuse 15 %) summed over a day on a horizontal
  // surface should agree with FAO-56 Eq. 37 within a few percent. Tolerance: 6 %.
  // Only high-sun days: Eq. 37 is a fixed share of Ra and does not lengthen the air mass at low sun (FAO-56 points to a
  // fuller form for such cases [memory]),
  // so at 46° N in December the two differ by about a third by construction.
  it.each([[-20, '2015-09-03', 0], [46, '2015-06-21', 2000], [0, '2015-03-21', 500]] as const)('lat %f on %s at %i m', (lat, date, z) => {
    const start = Date.parse(`${date}T00:00:00Z`);
    const doy = Math.round((start - Date.UTC(Number(date.slice(0, 4)), 0, 1)) / 86_400_000) + 1;
    let joules = 0;
    for (let minute = 5; minute < 1440; minute += 10) {
      const { zenithDeg, azimuthDeg } = solarPosition(new Date(start + minute * 60_000), lat, 0);
      const [cosZ] = sunGeometry(zenithDeg, azimuthDeg);
      const beam = clearSkyBeam(extraterrestrialNormal(doy), 0.75, pressureAt(z) / SEA_LEVEL_PRESSURE_PA, cosZ);
      joules += 600 * slopeIrradiance({ beamNormalWm2: beam, cosZenith: cosZ, cosIncidence: cosZ, diffuseFraction: 0.15, skyView: 1, groundView: 0, terrainAlbedo: 0, cloudFactor: 1 });
    }
    const rso = clearSkyDaily(lat, doy, z);
    expect(Math.abs(joules / 1e6 - rso) / rso).toBeLessThan(0.06);
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
