import { describe, expect, it } from 'vitest';
import { catchmentContribution, regionalTotal, transientContribution, type ContributionMember, type TransientContributionMember } from './regional-totals';
import type { SimulationSummary } from './simulation-summary';

/** A one-band summary whose daily runoff is `daily` (all of it snowmelt), from 2024-06-29. */
function summary(daily: number[]): SimulationSummary {
  const zeros = daily.map(() => 0);
  return {
    startDate: '2024-06-29', dayCount: daily.length, bands: [{ elevationM: 3000, areaM2: 2e6 }], months: [],
    dailyM3: { snow: daily, ice: zeros, debrisIce: zeros, rain: zeros }, routedDailyM3: null, start: null, shortwaveSource: null,
  };
}

const run = (base: number[], variant: number[], ensemble: [number[], number[]][] = []): ContributionMember[] => [
  { kind: 'baseline', ensembleIndex: null, summary: summary(base) },
  { kind: 'scenario', ensembleIndex: null, summary: summary(variant) },
  ...ensemble.flatMap(([b, v], i): ContributionMember[] => [
    { kind: 'ensemble-baseline', ensembleIndex: i, summary: summary(b) },
    { kind: 'ensemble-scenario', ensembleIndex: i, summary: summary(v) },
  ]),
];

describe('regional totals', () => {
  it('split a catchment\'s added runoff by calendar month and add the catchments up', () => {
    // 29 and 30 June, 1 and 2 July: 10 m³ a day more in June, 20 in July.
    const a = catchmentContribution(run([100, 100, 100, 100], [110, 110, 120, 120]));
    expect(a.addedVolumeM3).toBe(60);
    expect([...a.addedByPeriodM3]).toEqual([['2024-06', 20], ['2024-07', 40]]);
    expect(a.areaKm2).toBe(2);
    const b = catchmentContribution(run([50, 50, 50, 50], [55, 55, 55, 55]));
    const total = regionalTotal([b, a]);
    expect(total.addedVolumeM3).toBe(80);
    expect(total.periods).toEqual(['2024-06', '2024-07']);
    expect(total.addedByPeriodM3).toEqual([30, 50]);
    // Ranked by added volume: the second catchment given first.
    expect(total.ranking).toEqual([1, 0]);
    expect(total.addedVolumeRangeM3).toBeNull();
  });

  it('take the ensemble range of the region from the sums of members sharing a parameter set, not from summed percentiles', () => {
    const members = (offsets: number[]) => offsets.map((o): [number[], number[]] => [[100, 100], [100 + o, 100 + o]]);
    const a = catchmentContribution(run([100, 100], [110, 110], members([1, 2, 3, 4, 5])));
    const b = catchmentContribution(run([100, 100], [110, 110], members([5, 4, 3, 2, 1])));
    // Member i adds 2·(offset_a + offset_b) = 12 m³ in every member: no spread in the region at all.
    const total = regionalTotal([a, b]);
    expect(total.addedVolumeRangeM3).toEqual({ p5: 12, p50: 12, p95: 12 });
    // While each catchment alone spreads from 2 to 10 m³.
    expect(Math.min(...a.ensembleAddedM3.values())).toBe(2);
    expect(Math.max(...a.ensembleAddedM3.values())).toBe(10);
  });

  it('give no regional range when the catchments do not share their ensemble members', () => {
    const a = catchmentContribution(run([1, 1], [2, 2], [[[1, 1], [2, 2]]]));
    const b = catchmentContribution(run([1, 1], [2, 2]));
    expect(regionalTotal([a, b]).addedVolumeRangeM3).toBeNull();
  });

  it('add a multi-decade run up year by year, every source, netting the years in which the darkened glacier gives less', () => {
    const year = (y: number, snow: number, ice: number) => ({
      year: y, recordYear: 2022, temperatureDeltaC: 0, precipitationFactor: 1, glacierAreaKm2: 1, glacierVolumeKm3: 0.1, massBalanceMm: 0,
      volumeChangeM3: 0, runoffM3: { snow, ice, debrisIce: 0, rain: 10 }, glacierRunoffM3: ice, bandGlacierAreaKm2: [1],
    });
    const bands = [{ elevationM: 3000, areaM2: 4e6 }];
    const members: TransientContributionMember[] = [
      { kind: 'baseline', summary: { bands, years: [year(2030, 100, 50), year(2031, 100, 50)] } },
      { kind: 'scenario', summary: { bands, years: [year(2030, 100, 80), year(2031, 100, 40)] } },
    ];
    const c = transientContribution(members);
    expect([...c.addedByPeriodM3]).toEqual([['2030', 30], ['2031', -10]]);
    expect(c.addedVolumeM3).toBe(20);
    // Over two mean Gregorian years; 20 m³ over 4 km² is 0.005 mm.
    expect(c.meanAddedDischargeM3s).toBeCloseTo(20 / (2 * 365.2425 * 86400), 15);
    expect(c.addedDepthMm).toBeCloseTo(0.005, 12);
    expect(c.ensembleAddedM3.size).toBe(0);
    expect(regionalTotal([c, c]).addedByPeriodM3).toEqual([60, -20]);
  });
});
