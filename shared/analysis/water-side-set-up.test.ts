import { describe, expect, it } from 'vitest';
import { NO_WATER_SIDE } from './water-side-inputs';
import { waterSideLines } from './water-side-set-up';

describe('the water side of a run in plain lines', () => {
  it('says what is off when nothing is on', () => {
    const lines = waterSideLines({ water: NO_WATER_SIDE, waterBalancePrecipitation: false });
    expect(lines.map((l) => l.label)).toEqual(['Band temperature and precipitation', 'Precipitation', 'Snow redistribution', 'Runoff routing']);
    expect(lines[2].value).toMatch(/^Off/);
    expect(lines[3].value).toMatch(/^Off/);
  });

  it('names the fit, the closure, the processes and their sources when they are on, and never a source tag', () => {
    const lines = waterSideLines({
      waterBalancePrecipitation: true,
      water: {
        ...NO_WATER_SIDE,
        gradients: {
          lapseRatesKPerKm: Array(12).fill(-5.8), profiles: Array(12).fill({ kind: 'linear', gradientPerKm: 0.44 }), damping: null,
          origin: { lapseRate: [...Array(11).fill('fitted'), 'set by hand'], profile: Array(12).fill('fitted'), stationCount: 4 },
        },
        closure: { precipitationFactor: 1.52, profile: { kind: 'linear', gradientPerKm: 0.44 }, period: { from: '2023-10-01', to: '2024-09-30' }, savedBy: 'A. Analyst', savedAt: '2026-12-02T10:00:00Z', ratio: 1.52 },
        redistribution: { avalanche: { parameters: {} }, windDrift: { factors: [0.7, 1, 1.3] } },
        routing: { parameters: { iceStorageHours: 20 } },
      },
    });
    const text = lines.map((l) => l.value).join(' ');
    expect(lines[0].value).toBe('From 4 stations: lapse rate −5.8 °C per km over the year (11 months fitted, 1 month set by hand); precipitation linear, +44 % per km above the reference station (fitted).');
    expect(lines[1].value).toMatch(/factor 1.52 on the station record/);
    expect(text).toMatch(/Bernhardt & Schulz 2010/);
    expect(text).toMatch(/bare-ice melt 20 h/);
    expect(text).not.toMatch(/\[(memory|read)/);
  });
});
