import { describe, expect, it } from 'vitest';
import { DEMO_REFERENCE_STATION, statedAccuracy } from './demo-stations';

describe('the demo stations\' stated accuracy', () => {
  it('is read from the station\'s fields, where it is stated once', () => {
    expect(statedAccuracy(DEMO_REFERENCE_STATION)).toEqual({ temperature: '±0.3 °C (invented)', precipitation: '±10 %, snow undercatch not corrected (invented)' });
  });

  it('names the station and variable a statement is missing for', () => {
    expect(() => statedAccuracy({ ...DEMO_REFERENCE_STATION, accuracy: [{ variable: 'temperature', statement: '±1 °C' }] }))
      .toThrow(`Demo station ${DEMO_REFERENCE_STATION.name} states no precipitation accuracy.`);
  });
});
