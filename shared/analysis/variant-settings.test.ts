import { describe, expect, it } from 'vitest';
import { simulationSettings } from './variant-settings';

const season = { from: '2022-04-01', to: '2022-09-30' };

describe('a variant inherits what it does not set from its baseline', () => {
  it('takes the baseline period when it has none', () => {
    expect(simulationSettings({ period: null, parameters: {} }, { period: season, parameters: {} }).period).toEqual(season);
  });

  it('keeps its own period over the baseline one', () => {
    const own = { from: '2023-05-01', to: '2023-08-31' };
    expect(simulationSettings({ period: own, parameters: {} }, { period: season, parameters: {} }).period).toEqual(own);
  });

  it('merges parameters, its own winning', () => {
    const settings = simulationSettings(
      { period: null, parameters: { lapseRateCPerKm: -5.5 } },
      { period: null, parameters: { lapseRateCPerKm: -6.5, rainSnowThresholdC: 1 } },
    );
    expect(settings.parameters).toEqual({ lapseRateCPerKm: -5.5, rainSnowThresholdC: 1 });
  });

  it('is its own settings for the baseline (no baseline to inherit from)', () => {
    expect(simulationSettings({ period: null, parameters: { rainSnowThresholdC: 1 } }, null))
      .toEqual({ period: null, parameters: { rainSnowThresholdC: 1 }, physics: { stabilityCorrection: false }, waterBalancePrecipitation: false });
  });

  it('takes the baseline\'s stability correction unless it sets its own', () => {
    const baseline = { period: null, parameters: {}, stabilityCorrection: true };
    expect(simulationSettings({ period: null, parameters: {}, stabilityCorrection: null }, baseline).physics).toEqual({ stabilityCorrection: true });
    expect(simulationSettings({ period: null, parameters: {}, stabilityCorrection: false }, baseline).physics).toEqual({ stabilityCorrection: false });
    expect(simulationSettings({ period: null, parameters: {} }, null).physics).toEqual({ stabilityCorrection: false });
  });

  it('takes the water-balance precipitation from the baseline unless it sets its own source', () => {
    expect(simulationSettings({ precipitationSource: null }, { precipitationSource: 'water-balance' }).waterBalancePrecipitation).toBe(true);
    expect(simulationSettings({ precipitationSource: 'station' }, { precipitationSource: 'water-balance' }).waterBalancePrecipitation).toBe(false);
    expect(simulationSettings({}, null).waterBalancePrecipitation).toBe(false);
  });
});
