import { describe, expect, it } from 'vitest';
import { HydrologyInputError } from '../hydrology/errors';
import { completeRecordYears, planTransient } from './transient-plan';
import { forcingOfPeriod } from './transient-member';

const options = { fromYear: 2025, years: 20, warmingLevelC: 2, targetYear: 2050, regionalFactor: 1.5, precipitationChangePercent: 10, recordYears: 'repeat' as const, seed: 1 };

describe('the years of a multi-decade run', () => {
  it('are the record\'s complete mass-balance years, 1 October – 30 September in the north, 1 April – 31 March in the south (common practice)', () => {
    expect(completeRecordYears({ from: '2021-10-01', to: '2024-09-30' }, 34).map((y) => [y.year, y.from, y.to])).toEqual([
      [2022, '2021-10-01', '2022-09-30'], [2023, '2022-10-01', '2023-09-30'], [2024, '2023-10-01', '2024-09-30'],
    ]);
    expect(completeRecordYears({ from: '2021-10-02', to: '2024-09-29' }, 34).map((y) => y.year)).toEqual([2023]);
    expect(completeRecordYears({ from: '2021-01-15', to: '2023-06-30' }, -33).map((y) => [y.from, y.to])).toEqual([['2021-04-01', '2022-03-31'], ['2022-04-01', '2023-03-31']]);
  });

  it('follow the warming path from the warming already in the record (its middle year) to the level by the target year', () => {
    const plan = planTransient(options, completeRecordYears({ from: '2021-10-01', to: '2024-09-30' }, 34));
    expect(plan.years.map((y) => y.recordYear).slice(0, 4)).toEqual([2022, 2023, 2024, 2022]);
    // Record year 2023; 2025 is 2/27 of the way to 2050: (2 − 1.09) · 2/27 · 1.5 (hand-checked).
    expect(plan.years[0].temperatureDeltaC).toBeCloseTo(((2 - 1.09) * 2 / 27) * 1.5, 10);
    expect(plan.globalWarmingC[0]).toBeCloseTo(1.09 + (2 - 1.09) * 2 / 27, 10);
    expect(plan.years[0].precipitationFactor).toBeCloseTo(1 + 0.1 * 2 / 27, 10);
    expect(plan.periods[2023]).toEqual({ from: '2022-10-01', to: '2023-09-30' });
  });

  it('refuse a record without a complete year and a target before the record, naming the field', () => {
    expect(() => planTransient(options, [])).toThrow(HydrologyInputError);
    try {
      planTransient({ ...options, targetYear: 2020 }, completeRecordYears({ from: '2021-10-01', to: '2024-09-30' }, 34));
    } catch (error) {
      expect((error as HydrologyInputError).issues[0].path).toBe('targetYear');
    }
  });

  it('give each year only its own forcing (hourly temperature, daily precipitation)', () => {
    const forcing = { timeStep: 'hourly' as const, start: '2022-01-01', temperatureC: Array.from({ length: 24 * 4 }, (_, h) => h), precipitationMm: [1, 2, 3, 4], precipitationStep: 'daily' as const };
    const year = forcingOfPeriod(forcing, { from: '2022-01-02', to: '2022-01-03' });
    expect(year.start).toBe('2022-01-02');
    expect(year.precipitationMm).toEqual([2, 3]);
    expect(year.timeStep === 'hourly' && year.temperatureC).toEqual(Array.from({ length: 48 }, (_, h) => h + 24));
  });
});
