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

  it('simulate band groups separately and merge them into the same result as one run when loads agree', () => {
    const input = { ...inventedValley({ bandCount: 4, years: 1, timeStep: 'daily' }), period: { from: '2022-05-01', to: '2022-08-31' } };
    const uniform = scenarioChangesSchema.parse({ blackCarbonSnowNgG: 300 });
    const whole = simulateSummary({ ...input, scenario: engineInputOf(uniform).scenario });
    const scenario = engineInputOf(uniform).scenario;
    const split = simulateSummary({ ...input, scenario, parts: [{ bandIndices: [2, 0], scenario }, { bandIndices: [1, 3], scenario }] });
    expect(split.bands).toEqual(whole.bands);
    expect(split.months.map((m) => [m.bandIndex, m.month])).toEqual(whole.months.map((m) => [m.bandIndex, m.month]));
    split.months.forEach((m, i) => expect(m.iceMeltMm).toBeCloseTo(whole.months[i].iceMeltMm, 9));
    split.dailyM3.snow.forEach((v, d) => expect(v).toBeCloseTo(whole.dailyM3.snow[d], 6));
  });
});
