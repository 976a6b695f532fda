import { describe, expect, it } from 'vitest';
import { geodeticBalanceChart, hypsometryComparisonChart, snowCoverChart } from './geodata-charts';

const band = (lowerM: number, upperM: number, areaKm2: number) => ({ lowerM, upperM, areaKm2, slopeDeg: 20, aspectDeg: 0, glacierFraction: 0, debrisFraction: 0, debrisThicknessM: 0 });

describe('geodata charts', () => {
  it('draws hypsometry as area per 100 m, so a 200 m band and 50 m steps compare, and merges the response units of a band', () => {
    const table = [{ ...band(4000, 4200, 3), aspectClass: 'N' as const }, { ...band(4000, 4200, 1), aspectClass: 'S' as const }, band(4200, 4400, 2)];
    const steps = [{ lowerM: 4000, upperM: 4050, areaKm2: 0.5, glacierAreaKm2: 0, debrisAreaKm2: 0 }];
    const { option, table: rows } = hypsometryComparisonChart(table, steps);
    const [inUse, derived] = (option.series as { data: number[][] }[]).map((s) => s.data);
    expect(inUse).toEqual([[2, 4000], [2, 4200], [1, 4200], [1, 4400]]);
    expect(derived).toEqual([[1, 4000], [1, 4050]]);
    expect(rows.rows).toHaveLength(1);
  });

  it('shows bands hidden by cloud as gaps in the snow-cover chart, and the shares in percent in its table', () => {
    const maps = [{
      uploadId: 1, observedOn: '2024-04-20', fileName: 'a.tif', catchment: { snowCoveredFraction: 0.5, validFraction: 0.8, cloudFraction: 0.2 },
      rows: [{ lowerM: 4000, upperM: 4200, snowCoveredFraction: 0.25, validFraction: 0.9, cloudFraction: 0.1 }, { lowerM: 4200, upperM: 4400, snowCoveredFraction: null, validFraction: 0, cloudFraction: 1 }],
    }];
    const { option, table } = snowCoverChart(maps);
    expect((option.series as { data: unknown[] }[])[0].data).toEqual([[0, 0, 25], [0, 1, '-']]);
    expect(table.rows[1]).toMatchObject({ snow: null, valid: 0, cloud: 100 });
  });

  it('draws the geodetic balance at band mid-elevations with its ± 1 σ lines', () => {
    const change = {
      uploadId: 1, fileName: 'd.tif', fromDate: '2000-01-01', toDate: '2020-01-01', densityKgM3: 850,
      rows: [{ lowerM: 4000, upperM: 4200, glacierAreaKm2: 1, coveredFraction: 1, dhdtMPerYear: -1, dhdtSigmaMPerYear: 0.1, balanceMwePerYear: -0.85, balanceSigmaMwePerYear: 0.1 }],
    };
    const data = (geodeticBalanceChart(change).option.series as { data: number[][] }[]).map((s) => s.data[0]);
    expect(data).toEqual([[-0.85, 4100], [-0.95, 4100], [-0.75, 4100]]);
  });

  it('keeps the legend of a profile clear of the axis names: the names run along the axes and the plot starts below the wrapped legend', () => {
    const change = {
      uploadId: 1, fileName: 'd.tif', fromDate: '2000-01-01', toDate: '2020-01-01', densityKgM3: 850,
      rows: [{ lowerM: 4000, upperM: 4200, glacierAreaKm2: 1, coveredFraction: 1, dhdtMPerYear: -1, dhdtSigmaMPerYear: 0.1, balanceMwePerYear: -0.85, balanceSigmaMwePerYear: 0.1 }],
    };
    const option = geodeticBalanceChart(change).option as { legend: { type: string }; grid: { top: number }; yAxis: { name: string; nameLocation: string } };
    expect(option.yAxis).toMatchObject({ name: 'Elevation (m)', nameLocation: 'middle' });
    expect(option.legend.type).toBe('plain');
    // Three series, the first named with its period, wrap onto two rows at a phone's width.
    expect(option.grid.top).toBeGreaterThanOrEqual(24 + 2 * 22);
    expect((option as unknown as { series: { name: string }[] }).series[0].name).toBe('Geodetic balance 1 Jan 2000 to 1 Jan 2020');
  });
});
