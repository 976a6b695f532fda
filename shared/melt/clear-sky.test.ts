import { describe, expect, it } from 'vitest';
import { beamIndex, diffuseIndex, precipitableWaterMm, precipitableWaterFactor } from './clear-sky';
import { erbsDiffuseFraction } from './diffuse-split';
import { cloudinessFromTransmission, cloudOpticalThickness, cloudTransmission } from './cloud';
import { temperatureRangeClearSkyIndex } from './temperature-range';
import { extraterrestrialNormal } from './shortwave';
import { extraterrestrialDaily } from './fao56';
import { pressureAt } from './pressure';
import { solarPosition } from './solar-position';
import { simulate } from './simulate';
import { steadyClimate } from './fixtures/steady-climate';
import { saturationOverWater } from './vapour';

/**
 * ASCE-EWRI 2005 Appendix D, daily form (Eqs. D.1–D.5): the test's own oracle, written from the
 * report's equations, with sin β24 = sin(0.85 + 0.3 φ sin(2πJ/365 − 1.39) − 0.42 φ²) (Eq. D.5).
 */
function asceDailyClearSky(latDeg: number, dayOfYear: number, elevationM: number, vapourKPa: number): number {
  const phi = (latDeg * Math.PI) / 180;
  const ra = extraterrestrialDaily(latDeg, dayOfYear);
  const sinBeta = Math.max(0.1, Math.sin(0.85 + 0.3 * phi * Math.sin((2 * Math.PI * dayOfYear) / 365 - 1.39) - 0.42 * phi * phi));
  const p = pressureAt(elevationM) / 1000;
  const w = precipitableWaterMm(vapourKPa, p);
  const kb = 0.98 * Math.exp((-0.00146 * p) / sinBeta - 0.075 * Math.pow(w / sinBeta, 0.4));
  return (kb + diffuseIndex(kb)) * ra;
}

/** The engine's hourly clear sky on the horizontal at one elevation, summed over a day, MJ m⁻² d⁻¹, and its largest ratio to the extraterrestrial value. */
function engineClearDay(latDeg: number, date: string, elevationM: number, vapourKPa: number): { total: number; topRatio: number } {
  const start = Date.parse(`${date}T00:00:00Z`);
  const doy = Math.round((start - Date.UTC(Number(date.slice(0, 4)), 0, 1)) / 86_400_000) + 1;
  const p = pressureAt(elevationM) / 1000;
  const w = precipitableWaterMm(vapourKPa, p);
  let joules = 0;
  let topRatio = 0;
  for (let minute = 5; minute < 1440; minute += 10) {
    const { zenithDeg } = solarPosition(new Date(start + minute * 60_000), latDeg, 0);
    const cosZ = Math.cos((zenithDeg * Math.PI) / 180);
    if (cosZ <= 0) continue;
    const kb = beamIndex(p, cosZ, w, 1);
    const global = (kb + diffuseIndex(kb)) * extraterrestrialNormal(doy) * cosZ;
    topRatio = Math.max(topRatio, global / (extraterrestrialNormal(doy) * cosZ));
    joules += 600 * global;
  }
  return { total: joules / 1e6, topRatio };
}

describe('ASCE-EWRI 2005 clear sky (Allen et al. 2005, Appendix D)', () => {
  it('reproduces the standard daily example, Fallon NV, 1 July 2015 (as computed by the RefET package\'s own tests): W 17.11 mm, Rso 31.57 MJ m⁻² d⁻¹', () => {
    // Site 39.4575 N, 1208.5 m, air pressure 87.819 kPa, ea 1.2207 kPa, Ra 41.676 MJ m⁻² d⁻¹ [read].
    expect(precipitableWaterMm(1.2206674, 87.818764)).toBeCloseTo(17.10765, 4);
    const lat = 39.4575;
    const phi = (lat * Math.PI) / 180;
    const sinBeta = Math.sin(0.85 + 0.3 * phi * Math.sin((2 * Math.PI * 182) / 365 - 1.39) - 0.42 * phi * phi);
    const kb = 0.98 * Math.exp((-0.00146 * 87.818764) / sinBeta - 0.075 * Math.pow(17.107651 / sinBeta, 0.4));
    expect((kb + diffuseIndex(kb)) * 41.676108).toBeCloseTo(31.5659, 3);
  });
  it('KD follows Eq. D.4 on both sides of KB = 0.15', () => {
    expect(diffuseIndex(0.5)).toBeCloseTo(0.35 - 0.36 * 0.5, 12);
    expect(diffuseIndex(0.1)).toBeCloseTo(0.18 + 0.82 * 0.1, 12);
  });
  // Tolerance 5 % (4 % but in the low winter sun): the daily form weights the sun's elevation once per day (Eq. D.5); the hourly sum does it every 10 minutes.
  const cases = [[0, '2015-03-21'], [27.9, '2015-06-21'], [27.9, '2015-12-21'], [33.9, '2015-04-15'], [46, '2015-06-21'], [-20, '2015-09-03']] as const;
  for (const [lat, date] of cases) {
    it(`summed over a day agrees with the daily standard within 5 % from sea level to 8000 m (lat ${lat}, ${date})`, () => {
      const doy = Math.round((Date.parse(`${date}T00:00:00Z`) - Date.UTC(2015, 0, 1)) / 86_400_000) + 1;
      for (const z of [0, 2000, 4000, 6000, 8000]) {
        const ea = 0.6 * Math.exp(-z / 2000);
        const engine = engineClearDay(lat, date, z, ea).total;
        const standard = asceDailyClearSky(lat, doy, z, ea);
        expect(Math.abs(engine - standard) / standard).toBeLessThan(0.05);
      }
    });
  }
  it('never exceeds the extraterrestrial value, not even at 8848 m in dry air', () => {
    for (const z of [0, 4000, 8848]) expect(engineClearDay(27.99, '2015-06-21', z, 0.01).topRatio).toBeLessThanOrEqual(0.98);
  });
  it('carries precipitable water to a band with a 2 km scale height: a third at 2.2 km above the station', () => {
    expect(precipitableWaterFactor(5200, 3000) ** (1 / 0.4)).toBeCloseTo(Math.exp(-1.1), 10);
  });
});

describe('diffuse fraction (Erbs, Klein & Duffie 1982)', () => {
  it('is nearly all diffuse under overcast, 0.165 under clear skies, and falls in between', () => {
    expect(erbsDiffuseFraction(0.1)).toBeCloseTo(0.991, 3);
    expect(erbsDiffuseFraction(0.85)).toBe(0.165);
    let previous = 1;
    for (let kt = 0.05; kt <= 0.8; kt += 0.05) {
      const kd = erbsDiffuseFraction(kt);
      expect(kd).toBeLessThanOrEqual(previous + 1e-12);
      previous = kd;
    }
  });
  it('is continuous at both breaks (within 0.01)', () => {
    expect(Math.abs(erbsDiffuseFraction(0.2200001) - erbsDiffuseFraction(0.22))).toBeLessThan(0.01);
    expect(Math.abs(erbsDiffuseFraction(0.8000001) - erbsDiffuseFraction(0.8))).toBeLessThan(0.01);
  });
});

describe('cloud (Kasten & Czeplak 1980; two-stream optical thickness)', () => {
  it('transmission and cloudiness invert each other', () => {
    for (const n of [0.1, 0.4, 0.7, 0.95]) expect(cloudinessFromTransmission(cloudTransmission(n))).toBeCloseTo(n, 9);
  });
  it('a clear sky has no optical thickness; halving the light takes τ ≈ 9', () => {
    expect(cloudOpticalThickness(1)).toBe(0);
    expect(cloudOpticalThickness(0.5)).toBeCloseTo(1 / 0.1125, 6);
  });
});

describe('radiation from the daily temperature range (FAO-56 Eq. 50)', () => {
  it('Rs = kRs √ΔT Ra as a share of the clear sky, capped at 1', () => {
    expect(temperatureRangeClearSkyIndex(12, 40, 30, 0.16)).toBeCloseTo((0.16 * Math.sqrt(12) * 40) / 30, 12);
    expect(temperatureRangeClearSkyIndex(40, 40, 30, 0.19)).toBe(1);
    expect(temperatureRangeClearSkyIndex(-1, 40, 30, 0.16)).toBe(0);
  });
});

describe('shortwave sources in a run', () => {
  const day = steadyClimate({ days: 3, start: '2022-06-20', latitudeDeg: 46, bands: [{ glacierFraction: 1 }], initialSweMm: [0] });
  const { cloudiness, ...withoutCloud } = day.forcing;
  it('takes measured radiation first, then cloudiness, then the temperature range', () => {
    expect(cloudiness).toBeDefined();
    const measured = simulate({ ...day, forcing: { ...day.forcing, globalRadiationWm2: Array(72).fill(200) } });
    const cloud = simulate(day);
    const range = simulate({ ...day, forcing: withoutCloud });
    expect([measured.shortwaveSource, cloud.shortwaveSource, range.shortwaveSource]).toEqual(['measured', 'cloudiness', 'temperature-range']);
  });
  it('a measured daily mean of 200 W m⁻² reaches a flat band as about 200 W m⁻² (cloud index from the station\'s clear sky; within 3 %)', () => {
    const flat = { ...day, catchment: { ...day.catchment, bands: [{ ...day.catchment.bands[0], lowerM: 2990, upperM: 3010 }] } };
    const r = simulate({ ...flat, forcing: { ...flat.forcing, globalRadiationWm2: Array(72).fill(200) } });
    expect(Math.abs(r.bandDay.incomingShortwaveWm2[1] - 200) / 200).toBeLessThan(0.03);
  });
  it('cloud moves beam into diffuse: an overcast day on a north slope loses less than on a south slope', () => {
    const slopes = { ...day, initialState: { sweMm: [0, 0] }, catchment: { ...day.catchment, bands: [{ ...day.catchment.bands[0], slopeDeg: 35, aspectDeg: 180 }, { ...day.catchment.bands[0], slopeDeg: 35, aspectDeg: 0 }] } };
    const clear = simulate({ ...slopes, forcing: { ...slopes.forcing, cloudiness: Array(72).fill(0) } });
    const overcast = simulate({ ...slopes, forcing: { ...slopes.forcing, cloudiness: Array(72).fill(1) } });
    const loss = (b: number) => 1 - overcast.bandDay.incomingShortwaveWm2[b * 3 + 1] / clear.bandDay.incomingShortwaveWm2[b * 3 + 1];
    expect(loss(1)).toBeLessThan(loss(0));
  });
  it('vapour pressure for the standard comes from the air: e = RH es(T) (Bolton 1980)', () => {
    expect(saturationOverWater(0)).toBeCloseTo(611.2, 6);
  });
});
