import { describe, expect, it } from 'vitest';
import { inventedValley } from '../melt/fixtures/invented-valley';
import { scenarioChangesSchema } from '../schemas/scenarios';
import { groupBands, scenarioForBand } from './band-parts';
import { simulateSummary } from './simulate-summary';
import { engineInputOf } from './engine-input';

const changes = scenarioChangesSchema.parse({
  blackCarbonSnowNgG: 100,
  impuritiesByElevation: [{ fromM: 3000, toM: 3600, blackCarbonSnowNgG: 900 }, { fromM: 3400, toM: 9000, dustIceUgG: 50 }],
});

describe('impurities by elevation range', () => {
  it('replace the scenario-wide load in bands whose mean elevation lies in the first matching range', () => {
    expect(scenarioForBand(changes, 2500).blackCarbonSnowNgG).toBe(100);
    expect(scenarioForBand(changes, 3500)).toMatchObject({ blackCarbonSnowNgG: 900, dustIceUgG: 0 });
    expect(scenarioForBand(changes, 3700)).toMatchObject({ blackCarbonSnowNgG: 100, dustIceUgG: 50 });
  });

  it('group bands that share a scenario, and none when all do', () => {
    const parts = groupBands([2500, 3500, 3550, 3700].map((m) => scenarioForBand(changes, m)));
    expect(parts?.map((p) => p.bandIndices)).toEqual([[0], [1, 2], [3]]);
    expect(groupBands([1, 2].map(() => scenarioForBand(changes, 2000)))).toBeNull();
  });

  it('give each band its group’s loads in one run: the same as simulating each group on its own', () => {
    const input = { ...inventedValley({ bandCount: 4, years: 1, timeStep: 'daily' }), period: { from: '2022-05-01', to: '2022-08-31' } };
    const bands = input.catchment.bands;
    const clean = engineInputOf(scenarioChangesSchema.parse({})).scenario;
    const dirty = engineInputOf(scenarioChangesSchema.parse({ blackCarbonSnowNgG: 300, blackCarbonIceNgG: 900 })).scenario;
    const together = simulateSummary({ ...input, scenario: clean, parts: [{ bandIndices: [2, 0], scenario: dirty }, { bandIndices: [1, 3], scenario: clean }] });
    const alone = (indices: number[], scenario: typeof clean) => simulateSummary({ ...input, scenario, catchment: { ...input.catchment, bands: indices.map((b) => bands[b]) } });
    const dirtyBands = alone([2, 0], dirty);
    const cleanBands = alone([1, 3], clean);
    const iceMelt = (s: typeof together, band: number) => s.months.filter((m) => m.bandIndex === band).reduce((t, m) => t + m.iceMeltMm, 0);
    expect(iceMelt(together, 2)).toBeCloseTo(iceMelt(dirtyBands, 0), 9);
    expect(iceMelt(together, 0)).toBeCloseTo(iceMelt(dirtyBands, 1), 9);
    expect(iceMelt(together, 3)).toBeCloseTo(iceMelt(cleanBands, 1), 9);
    expect(iceMelt(together, 2)).toBeGreaterThan(iceMelt(alone([2], clean), 0));
  });
});
