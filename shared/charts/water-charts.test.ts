import { describe, expect, it } from 'vitest';
import type { GradientsReply } from '../schemas/gradients';
import type { TransientResults, TransientSeries } from '../schemas/transient-results';
import type { WaterBalanceClosure } from '../schemas/water-balance';
import { lapseRateChart, precipitationProfileChart } from './gradient-charts';
import { balanceTermsChart, precipitationByElevationChart } from './water-balance-charts';
import { glacierRunoffChart, runoffBySourceChart } from './transient-charts';

type Series = { name: string; data: unknown[]; markLine?: { data: { xAxis: string }[] } };
const seriesOf = (option: Record<string, unknown>) => option.series as Series[];

const months = (v: number) => Array<number>(12).fill(v);
const gradients: GradientsReply = {
  referenceElevationM: 3000,
  stations: [
    { id: 1, name: 'Low', network: '', elevationM: 3000, isReference: true, monthlyTemperatureC: months(10), monthlyPrecipitationMm: months(50), annualPrecipitationMm: 600 },
    { id: 2, name: 'High', network: '', elevationM: 4000, isReference: false, monthlyTemperatureC: months(4), monthlyPrecipitationMm: months(75), annualPrecipitationMm: 900 },
  ],
  periods: { temperature: { from: '2022-10-01', to: '2024-09-30' }, precipitation: { from: '2022-10-01', to: '2024-09-30' } },
  lapseRates: Array.from({ length: 12 }, (_, month) => ({ month, lapseRateKPerKm: -6, standardErrorKPerKm: null, interceptC: 28, r2: null, n: 2, status: 'fitted' as const, note: '' })),
  precipitationFits: [{ label: 'Annual totals', profile: { kind: 'linear', gradientPerKm: 0.5 }, referencePrecipitationMm: 600, standardErrors: {}, r2: 1, n: 2, status: 'fitted', notes: [] }],
  precipitationPerMonth: false,
  chosen: { lapseRatesKPerKm: months(-6), profiles: Array(12).fill({ kind: 'linear', gradientPerKm: 0.5 }), lapseRateOrigin: Array(12).fill('fitted'), profileOrigin: Array(12).fill('fitted') },
  bands: [{ midM: 3100, areaKm2: 2, glacierFraction: 0 }, { midM: 3900, areaKm2: 3, glacierFraction: 0.5 }],
  bandClimate: { temperatureOffsetK: [], glacierTemperatureOffsetK: [], precipitationMultiplier: [] },
  inUse: true,
  notes: [],
};

describe('charts of the fitted gradients', () => {
  it('draw the stations as points, the lapse rate through the reference station and the bands as ticks', () => {
    const { option, table } = lapseRateChart(gradients, 6);
    const [stations, line, ticks] = seriesOf(option);
    expect(stations.data).toEqual([{ value: [10, 3000], name: 'Low' }, { value: [4, 4000], name: 'High' }]);
    // −6 °C/km from 10 °C at 3000 m over the stations' and bands' range 3000–4000 m: 10, 7 and 4 °C (hand-checked).
    expect(line.data).toEqual([[10, 3000], [7, 3500], [4, 4000]]);
    expect((ticks.data as number[][]).map((p) => p[1])).toEqual([3100, 3900]);
    expect(table.rows.at(-1)?.station).toMatch(/^Fit: −?-?6/);
  });
  it('draw the precipitation profile scaled to the reference station: 600 mm at 3000 m, 900 mm at 4000 m', () => {
    const { option } = precipitationProfileChart(gradients, 'annual');
    const curve = seriesOf(option)[1].data as number[][];
    expect(curve[0]).toEqual([600, 3000]);
    expect(curve.at(-1)).toEqual([900, 4000]);
  });
});

const terms = { precipitationMm: 1000, measuredRunoffMm: 800, modelledRunoffMm: 790, evaporationSublimationMm: 50, snowStorageChangeMm: 100, iceStorageChangeMm: -300, storesChangeMm: 10, closureMm: 340 };
const closure = {
  closed: true, messages: [], period: { from: '2022-10-01', to: '2023-09-30' }, form: 'linear', unknowns: ['precipitationFactor'],
  candidate: { precipitationFactor: 1.5, profile: { kind: 'linear', gradientPerKm: 0.5 } }, station: { precipitationFactor: 1, profile: { kind: 'linear', gradientPerKm: 0.5 } },
  uncertainty: { precipitationFactor: 0.05 }, balance: terms, stationBalance: { ...terms, precipitationMm: 700 },
  precipitationRatio: { value: 1.5, uncertainty: 0.05 }, misfits: [{ label: 'runoff', sigmas: -0.1 }],
  bands: [{ midM: 3100, areaKm2: 2, stationPrecipitationMm: 600, inferredPrecipitationMm: 900 }, { midM: 3900, areaKm2: 3, stationPrecipitationMm: 0, inferredPrecipitationMm: 0 }],
  observations: { runoff: { value: 800, uncertainty: 80, days: 365, filledDays: 0, source: 'gauge.csv' }, bandBalances: [] }, evaluations: 12,
} satisfies WaterBalanceClosure;

describe('charts of a water-balance closure', () => {
  it('put station and inferred precipitation side by side per band, with their ratio in the table (none where no precipitation falls)', () => {
    const { table } = precipitationByElevationChart(closure);
    expect(table.rows).toEqual([
      { z: 3100, area: 2, station: 600, inferred: 900, ratio: 1.5 },
      { z: 3900, area: 3, station: 0, inferred: 0, ratio: null },
    ]);
  });
  it('show every balance term with both precipitations, and what is left open in the table', () => {
    const { option, table } = balanceTermsChart(closure);
    expect(seriesOf(option)[0].data[0]).toBe(700);
    expect(seriesOf(option)[1].data[0]).toBe(1000);
    expect(table.rows.at(-1)).toEqual({ term: 'Left open (P − E − ΔS − measured runoff)', station: 340, inferred: 340 });
  });
});

const series = (peakYear: number | null, shift = 0): TransientSeries => ({
  glacierAreaKm2: [10, 9, 8], glacierVolumeKm3: [1, 0.9, 0.8], massBalanceMm: [-500, -600, -700],
  runoffM3: { snow: [1e6, 1e6, 1e6], ice: [2e6 + shift, 3e6, 2e6], debrisIce: [0, 0, 0], rain: [5e5, 5e5, 5e5] },
  glacierRunoffM3: [2e6, 3e6, 2e6], smoothedGlacierRunoffM3: [null, 2.5e6, null],
  peakWater: { year: peakYear, valueM3: 2.5e6, status: peakYear === null ? 'not reached' : 'reached', text: String(peakYear) },
  bandGlacierAreaKm2: { first: [5, 5], last: [4, 4] }, finalVolumeKm3: 0.7,
});

describe('charts of a multi-decade run', () => {
  const results = { years: [2025, 2026, 2027], bands: [{ elevationM: 4000, areaM2: 1e7 }, { elevationM: 4400, areaM2: 1e7 }], baseline: series(2026), variant: series(null, 1e6) } as unknown as TransientResults;
  it('mark peak water where it is reached, and only there', () => {
    const s = seriesOf(glacierRunoffChart(results, 'Darker').option);
    expect(s[1].markLine?.data).toEqual([{ xAxis: '2026' }]);
    expect(s[3].markLine).toBeUndefined();
    expect(s[1].data).toEqual([null, 2.5, null]);
  });
  it('stack the variant\'s runoff by source in million m³ beside the baseline total', () => {
    const { table } = runoffBySourceChart(results, 'Darker');
    expect(table.rows[0]).toEqual({ year: 2025, snow: 1, ice: 3, debrisIce: 0, rain: 0.5, baseline: 3.5 });
  });
});
