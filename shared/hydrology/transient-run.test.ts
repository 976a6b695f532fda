import { describe, expect, it } from 'vitest';
import { initialGlacier, type GlacierBand } from './glacier-volume';
import { recordYearSequence } from './record-years';
import { runTransient, transientYears, type YearSimulator } from './transient-run';
import { warmingPath } from './warming-path';

/**
 * A synthetic catchment and a simple year model standing in for the engine (invented numbers):
 * accumulation 900 mm w.e. a year on the glacier, ablation falling 0.9 mm per metre of elevation and
 * rising 600 mm per kelvin of warming; `darkening` scales ablation as darker ice would.
 */
const bands: GlacierBand[] = Array.from({ length: 10 }, (_, i) => ({ lowerM: 3600 + 200 * i, upperM: 3800 + 200 * i, areaKm2: 8, glacierFraction: [0.3, 0.4, 0.5, 0.55, 0.55, 0.5, 0.5, 0.45, 0.4, 0.3][i] }));
const initialArea = bands.map((b) => b.areaKm2 * b.glacierFraction);

function yearModel(darkening: number): YearSimulator {
  return (year, fraction) => {
    let balance = 0, area = 0, melt = 0;
    bands.forEach((b, i) => {
      const z = (b.lowerM + b.upperM) / 2;
      const ablation = darkening * Math.max(0, 1800 + 600 * year.temperatureDeltaC - 0.9 * (z - 3700));
      const a = fraction[i] * b.areaKm2;
      balance += a * (900 * year.precipitationFactor - ablation);
      area += a;
      melt += a * ablation * 1000; // mm over km² → m³
    });
    // Rain and melt from the initial glacier area that is now bare also count as glacier runoff; kept small here.
    const bareRain = bands.reduce((s, b, i) => s + (initialArea[i] - fraction[i] * b.areaKm2) * 200 * 1000, 0);
    return { glacierMassBalanceMm: area > 0 ? balance / area : 0, runoffM3: { snow: 1e7, ice: melt, debrisIce: 0, rain: bareRain }, glacierRunoffM3: melt + bareRain };
  };
}

describe('transient run with a shrinking glacier', () => {
  const path = warmingPath({ fromYear: 2020, toYear: 2099, warmingLevelC: 3, targetYear: 2080, recordYear: 2015, regionalFactor: 1.3 });
  const years = transientYears(path, recordYearSequence([2011, 2012, 2013, 2014, 2015], 80, 'resample', 4));
  const glacier = initialGlacier(bands);

  it('over 80 years the glacier shrinks, glacier runoff peaks inside the run, and darkening brings the peak earlier', () => {
    const baseline = runTransient(bands, glacier, years, yearModel(1));
    const darker = runTransient(bands, glacier, years, yearModel(1.15));
    expect(baseline.rows[79].glacierAreaKm2).toBeLessThan(0.7 * baseline.rows[0].glacierAreaKm2);
    expect(baseline.peakWater.status).toBe('reached');
    expect(darker.peakWater.status).toBe('reached');
    expect(darker.peakWater.year!).toBeLessThan(baseline.peakWater.year!);
    expect(darker.rows[79].glacierVolumeKm3).toBeLessThan(baseline.rows[79].glacierVolumeKm3);
  });

  it('each year the ice volume change equals the simulated balance: ΔV ρice = B A ρw (to 1e-9)', () => {
    const result = runTransient(bands, glacier, years, yearModel(1));
    for (const row of result.rows) {
      if (row.glacierAreaKm2 === 0) continue;
      const expected = (row.glacierMassBalanceMm / 1000) * row.glacierAreaKm2 * 1e6 * (1000 / 900);
      expect(Math.abs(row.volumeChangeM3 - expected)).toBeLessThanOrEqual(1e-9 * Math.abs(expected) + 1e-6);
    }
    for (let i = 1; i < result.rows.length; i++) {
      const drop = result.rows[i].glacierVolumeKm3 - result.rows[i - 1].glacierVolumeKm3;
      expect(drop * 1e9).toBeCloseTo(result.rows[i - 1].volumeChangeM3, 0);
    }
  });

  it('passes the year and the current glacier fractions to the engine, and refuses a year without runoff', () => {
    const seen: number[] = [];
    runTransient(bands, glacier, years.slice(0, 3), (year, fraction) => {
      seen.push(year.year);
      expect(fraction[3]).toBeLessThanOrEqual(0.55 + 1e-12);
      return yearModel(1)(year, fraction);
    });
    expect(seen).toEqual([2020, 2021, 2022]);
    expect(() => runTransient(bands, glacier, years.slice(0, 1), () => ({ glacierMassBalanceMm: 0, runoffM3: { snow: Number.NaN, ice: 0, debrisIce: 0, rain: 0 }, glacierRunoffM3: 0 })))
      .toThrow(/years\[0\].runoffM3.snow: the simulation of 2020 gave no snow runoff/);
    expect(() => transientYears(path, [2011])).toThrow(/^recordYears: 80 scenario years need as many record years/);
  });
});
