import { describe, expect, it } from 'vitest';
import { warmingPath } from './warming-path';

describe('warming path to a global warming level (IPCC AR6 levels above 1850–1900)', () => {
  const base = { fromYear: 2010, toYear: 2080, warmingLevelC: 2, targetYear: 2050, recordYear: 2015 };

  it("rises linearly from the record's 1.09 °C (IPCC AR6 SPM A.1.2 for 2011–2020 [memory]) to the level, then holds it (hand-worked)", () => {
    const p = warmingPath(base);
    const at = (y: number) => y - 2010;
    expect(p.years[0]).toBe(2010);
    expect(p.temperatureDeltaC[at(2012)]).toBe(0);
    expect(p.globalWarmingC[at(2015)]).toBeCloseTo(1.09, 12);
    expect(p.globalWarmingC[at(2050)]).toBeCloseTo(2, 12);
    expect(p.temperatureDeltaC[at(2050)]).toBeCloseTo(0.91, 12);
    expect(p.temperatureDeltaC[at(2080)]).toBeCloseTo(0.91, 12);
    // 2029 is 14/35 of the way: 1.09 + 0.4 × 0.91 = 1.454 °C.
    expect(p.globalWarmingC[at(2029)]).toBeCloseTo(1.454, 12);
  });

  it('scales the local change by the regional factor and ramps precipitation with the warming', () => {
    const p = warmingPath({ ...base, regionalFactor: 1.5, precipitationChangeAtTarget: 0.1 });
    expect(p.temperatureDeltaC[40]).toBeCloseTo(1.365, 12);
    expect(p.precipitationFactor[19]).toBeCloseTo(1.04, 12);
    expect(p.precipitationFactor[70]).toBeCloseTo(1.1, 12);
  });

  it('refuses years out of order, a target before the record and a level beyond 6 °C, naming the field', () => {
    expect(() => warmingPath({ ...base, toYear: 2000 })).toThrow(/^toYear: the last year \(2000\) comes before the first \(2010\)/);
    expect(() => warmingPath({ ...base, targetYear: 2015 })).toThrow(/^targetYear: the warming level must be reached after the record's year/);
    expect(() => warmingPath({ ...base, warmingLevelC: 7 })).toThrow(/^warmingLevelC/);
    expect(() => warmingPath({ ...base, toYear: 2300 })).toThrow(/at most 200 years/);
  });
});
