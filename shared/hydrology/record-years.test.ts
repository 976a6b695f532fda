import { describe, expect, it } from 'vitest';
import { recordYearSequence } from './record-years';

const record = [2011, 2012, 2013, 2014, 2015, 2016, 2017, 2018, 2019, 2020];

describe('record years for a transient scenario', () => {
  it('repeats the record in order', () => {
    expect(recordYearSequence(record.slice(0, 3), 7, 'repeat')).toEqual([2011, 2012, 2013, 2011, 2012, 2013, 2011]);
  });

  it('resamples whole years with replacement, the same for the same seed, different for another', () => {
    const a = recordYearSequence(record, 80, 'resample', 7);
    expect(recordYearSequence(record, 80, 'resample', 7)).toEqual(a);
    expect(recordYearSequence(record, 80, 'resample', 8)).not.toEqual(a);
    expect(a.every((y) => record.includes(y))).toBe(true);
    const counts = record.map((y) => recordYearSequence(record, 5000, 'resample', 3).filter((v) => v === y).length);
    // Uniform draws: each year ≈ 500 of 5000 (binomial σ ≈ 21); allow 5σ.
    for (const c of counts) expect(Math.abs(c - 500)).toBeLessThan(106);
  });

  it('refuses an empty record or no years', () => {
    expect(() => recordYearSequence([], 5, 'repeat')).toThrow(/^recordYears: the station record has no complete year/);
    expect(() => recordYearSequence(record, 0, 'repeat')).toThrow(/^count/);
  });
});
