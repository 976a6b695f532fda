import { describe, expect, it } from 'vitest';
import { scenarioSchema } from '../melt/schema';
import { changedDrivers, combinedScenario, termLabel } from './drivers';

const baseline = scenarioSchema.parse({});
const variant = scenarioSchema.parse({ blackCarbonSnowNgG: 300, temperatureDeltaC: 1.5, debrisExtentChange: 0.1 });

describe('attribution drivers', () => {
  it('finds the drivers in which a variant differs from the baseline', () => {
    expect(changedDrivers(baseline, variant)).toEqual(['blackCarbon', 'debris', 'warming']);
    expect(changedDrivers(baseline, baseline)).toEqual([]);
  });

  it('builds each combination from the variant for set bits and the baseline otherwise', () => {
    const drivers = changedDrivers(baseline, variant);
    expect(combinedScenario(baseline, variant, drivers, 0)).toEqual(baseline);
    expect(combinedScenario(baseline, variant, drivers, 0b111)).toEqual(variant);
    const warmingOnly = combinedScenario(baseline, variant, drivers, 0b100);
    expect(warmingOnly).toEqual({ ...baseline, temperatureDeltaC: 1.5 });
    expect(termLabel(drivers, 0b101)).toBe('Black carbon × Warming');
  });
});
