import { describe, expect, it } from 'vitest';
import { chooseMonthlyGradients, fitStationGradients } from './station-gradients';
import type { StationClimate } from './stations';

const bands = [{ lowerM: 2000, upperM: 3500, areaKm2: 30 }, { lowerM: 3500, upperM: 5500, areaKm2: 40 }];
const twelve = (v: number | null) => Array.from({ length: 12 }, () => v);
const stations: StationClimate[] = [
  { name: 'Lower Ferry', elevationM: 2100, monthlyTemperatureC: twelve(8), monthlyPrecipitationMm: twelve(30) },
  { name: 'Mill Shoulder', elevationM: 3100, monthlyTemperatureC: twelve(2), monthlyPrecipitationMm: twelve(45) },
  { name: 'High Cairn', elevationM: 4100, monthlyTemperatureC: twelve(-4), monthlyPrecipitationMm: twelve(60) },
];

describe('station gradients', () => {
  it('fits −6 K/km every month and a linear profile (+50 %/km relative to the reference) from three stations', () => {
    const g = fitStationGradients({ stations, bands, referenceElevationM: 2100, assumedLapseRateKPerKm: -6.5, precipitation: { kind: 'linear', perMonth: true, assumedGradientPerKm: 0.5 } });
    expect(g.lapseRates.map((r) => r.lapseRateKPerKm)).toEqual(twelve(-6).map((v) => expect.closeTo(v!, 9)));
    expect(g.precipitationFits).toHaveLength(12);
    expect(g.precipitationFits[0].profile).toEqual({ kind: 'linear', gradientPerKm: expect.closeTo(0.5, 9) });
  });

  it('fits one annual profile from complete years when asked', () => {
    const g = fitStationGradients({ stations, bands, referenceElevationM: 2100, assumedLapseRateKPerKm: -6.5, precipitation: { kind: 'linear', perMonth: false, assumedGradientPerKm: 0.5 } });
    expect(g.precipitationFits).toHaveLength(1);
    expect(g.precipitationFits[0].referencePrecipitationMm).toBeCloseTo(360, 9);
  });

  it('refuses a station above the catchment top, naming the station field', () => {
    const high = [...stations, { name: 'Summit Mast', elevationM: 5800, monthlyTemperatureC: twelve(-12) }];
    expect(() => fitStationGradients({ stations: high, bands, referenceElevationM: 2100, assumedLapseRateKPerKm: -6.5, precipitation: { kind: 'linear', perMonth: true, assumedGradientPerKm: 0.5 } }))
      .toThrow('stations[3].elevationM: station “Summit Mast” at 5800 m lies above the catchment\'s top (5500 m).');
  });

  it('refuses a peaked fit with fewer stations than parameters, saying how many it needs', () => {
    expect(() => fitStationGradients({ stations, bands, referenceElevationM: 2100, assumedLapseRateKPerKm: -6.5, precipitation: { kind: 'peaked', perMonth: false } }))
      .toThrow(/annual totals of complete years\): the peaked profile has 4 parameters .* at least 4 stations; there are 3/);
  });

  it('hand overrides replace single months and are marked as set by hand', () => {
    const g = fitStationGradients({ stations: stations.slice(0, 1), bands, referenceElevationM: 2100, assumedLapseRateKPerKm: -6.5, precipitation: { kind: 'linear', perMonth: true, assumedGradientPerKm: 0.5 } });
    const lapse = twelve(null);
    lapse[6] = -5;
    const chosen = chooseMonthlyGradients(g, { lapseRatesKPerKm: lapse });
    expect(chosen.lapseRatesKPerKm[6]).toBe(-5);
    expect(chosen.lapseRatesKPerKm[5]).toBe(-6.5);
    expect(chosen.lapseRateOrigin[6]).toBe('set by hand');
    expect(chosen.lapseRateOrigin[5]).toBe('assumed');
    expect(() => chooseMonthlyGradients(g, { profiles: [null] })).toThrow(/overrides.profiles: 12 values are needed .*; 1 was given/);
  });
});
