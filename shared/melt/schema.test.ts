import { describe, expect, it } from 'vitest';
import { simulate } from './simulate';
import { SimulationInputError } from './prepare';
import { fillShortGaps } from './fill-gaps';
import { steadyClimate } from './fixtures/steady-climate';
import { DEFAULT_PARAMETERS, PARAMETER_NAMES, PARAMETER_RANGES } from './parameters';

const base = steadyClimate({ days: 2 });
const refusal = (input: unknown): string => {
  try {
    simulate(input);
  } catch (error) {
    expect(error).toBeInstanceOf(SimulationInputError);
    return (error as Error).message;
  }
  throw new Error('the input was accepted');
};

describe('simulationInputSchema refuses bad input, naming field and problem', () => {
  it('a band with a negative area', () => {
    const input = structuredClone(base);
    input.catchment.bands[0].areaKm2 = -1;
    expect(refusal(input)).toMatch(/catchment\.bands\[0\]\.areaKm2: .*>0/);
  });
  it('a band whose top is below its bottom', () => {
    const input = structuredClone(base);
    input.catchment.bands[0].upperM = 100;
    expect(refusal(input)).toMatch(/catchment\.bands\[0\]\.upperM: must be above the lower elevation/);
  });
  it('an unknown time zone', () => {
    expect(refusal({ ...base, catchment: { ...base.catchment, timeZone: 'Mars/Olympus' } })).toMatch(/catchment\.timeZone: is not a known IANA time zone/);
  });
  it('a missing forcing value, with its index', () => {
    const input = structuredClone(base);
    if (input.forcing.timeStep !== 'hourly') throw new Error('hourly expected');
    input.forcing.temperatureC[30] = null;
    input.forcing.temperatureC[31] = null;
    expect(refusal(input)).toMatch(/forcing\.temperatureC\[30\]: is missing \(2 missing value/);
  });
  it('an hourly series that does not cover whole days', () => {
    const input = structuredClone(base);
    if (input.forcing.timeStep !== 'hourly') throw new Error('hourly expected');
    input.forcing.temperatureC.pop();
    expect(refusal(input)).toMatch(/forcing\.temperatureC: has 47 hourly values/);
  });
  it('a series of the wrong length', () => {
    expect(refusal({ ...base, forcing: { ...base.forcing, windMs: [1, 2, 3] } })).toMatch(/forcing\.windMs: has 3 values; 48 expected/);
  });
  it('relative humidity given in percent', () => {
    expect(refusal({ ...base, forcing: { ...base.forcing, relativeHumidity: Array(48).fill(70) } })).toMatch(/forcing\.relativeHumidity\[0\]: .*divide percent by 100/);
  });
  it('a parameter outside its range or unknown', () => {
    expect(refusal({ ...base, parameters: { turbidity: 1.5 } })).toMatch(/parameters\.turbidity/);
    expect(refusal({ ...base, parameters: { lapse: -6 } })).toMatch(/parameters: .*lapse/);
  });
  it('monthly scenario values that are not twelve', () => {
    expect(refusal({ ...base, scenario: { temperatureDeltaC: [1, 2, 3] } })).toMatch(/scenario\.temperatureDeltaC/);
  });
  it('a period outside the forcing', () => {
    expect(refusal({ ...base, period: { from: '2022-06-30', to: '2022-07-01' } })).toMatch(/period\.from: is before the forcing starts/);
  });
  it('an initial state with the wrong number of bands', () => {
    expect(refusal({ ...base, initialState: { sweMm: [1, 2] } })).toMatch(/initialState\.sweMm: has 2 values; one per band \(1\)/);
  });
  it('daily minimum above maximum', () => {
    expect(refusal({ ...base, forcing: { timeStep: 'daily', start: '2022-07-01', tMinC: [5, 9], tMaxC: [10, 8], precipitationMm: [0, 0] } })).toMatch(/forcing\.tMinC\[1\]: is above tMaxC/);
  });
});

describe('parameters', () => {
  it('every default lies inside its range and names a source', () => {
    for (const name of PARAMETER_NAMES) {
      const range = PARAMETER_RANGES[name];
      expect(DEFAULT_PARAMETERS[name]).toBeGreaterThanOrEqual(range.min);
      expect(DEFAULT_PARAMETERS[name]).toBeLessThanOrEqual(range.max);
      expect(range.source.length).toBeGreaterThan(10);
    }
  });
});

describe('fillShortGaps', () => {
  it('interpolates short gaps and leaves long and edge gaps missing', () => {
    expect(fillShortGaps([1, null, 3, null, null, null, 7], 2)).toEqual([1, 2, 3, null, null, null, 7]);
    expect(fillShortGaps([null, 1, null, 2], 1)).toEqual([null, 1, 1.5, 2]);
    expect(fillShortGaps([1, null, null, null, 5], 3)).toEqual([1, 2, 3, 4, 5]);
  });
});
