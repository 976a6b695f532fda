import { describe, expect, it } from 'vitest';
import type { SweepResultReply } from '../schemas/lab';
import { ostremChart, sweepChart } from './lab-charts';

const curve = (label: string, shift: number) => ({
  label, temperatureDeltaC: shift, debrisAlbedo: 0.15, cleanIceMeltMm: 100 + shift,
  points: [{ thicknessM: 0.005, meltMm: 130 + shift }, { thicknessM: 0.05, meltMm: 90 + shift }, { thicknessM: 0.5, meltMm: 20 + shift }],
  snowMeltMm: 40, peak: { thicknessM: 0.005, meltMm: 130 + shift }, criticalThicknessM: shift === 0 ? 0.03 : null,
});

describe('lab chart builders', () => {
  it('Østrem chart: table starts with clean ice at 0 m, marks the peak, the critical thickness and the clean-ice line', () => {
    const response = { ostrem: { present: curve('Present climate', 0), warmer: [curve('+1 °C', 1)], darker: curve('Darker debris', 5) } };
    const { option, table } = ostremChart(response);
    expect(table.rows[0]).toEqual({ h: 0, c0: 100, c1: 101, c2: 105 });
    expect(table.rows).toHaveLength(4);
    expect(table.columns.map((c) => c.label)).toEqual(['Debris thickness (m)', 'Present climate (mm w.e.)', '+1 °C (mm w.e.)', 'Darker debris (mm w.e.)']);
    const series = (option as { series: { markLine?: { data: { xAxis?: number; yAxis?: number }[] }; markPoint?: { data: { coord: number[] }[] } }[] }).series;
    expect(series[0].markPoint!.data[0].coord).toEqual([0.005, 130]);
    expect(series[0].markLine!.data.map((d) => d.yAxis ?? d.xAxis)).toEqual([100, 0.03]);
    expect(series[1].markLine).toBeUndefined();
  });
  it('sweep chart: a heat map cell per pair, and the same cells in the table', () => {
    const result: SweepResultReply = {
      axes: [{ variable: 'temperatureDeltaC', label: 'Temperature change', unit: '°C', values: [0, 1] }, { variable: 'iceAlbedo', label: 'iceAlbedo', unit: '-', values: [0.3, 0.35, 0.4] }],
      period: { from: '2022-06-01', to: '2022-08-31' }, baselineMeltMm: 10,
      meltMm: [[10, 9, 8], [14, 13, 12]], addedMeltMm: [[0, -1, -2], [4, 3, 2]],
    };
    const { option, table } = sweepChart(result);
    const data = (option as { series: { type: string; data: number[][] }[] }).series[0];
    expect(data.type).toBe('heatmap');
    expect(data.data).toEqual([[0, 0, 0], [0, 1, -1], [0, 2, -2], [1, 0, 4], [1, 1, 3], [1, 2, 2]]);
    expect(table.rows[4]).toEqual({ a: 1, b: 0.35, melt: 13, added: 3 });
  });
  it('sweep chart: a line for one parameter', () => {
    const result: SweepResultReply = {
      axes: [{ variable: 'temperatureDeltaC', label: 'Temperature change', unit: '°C', values: [0, 1, 2] }],
      period: { from: '2022-06-01', to: '2022-08-31' }, baselineMeltMm: 10, meltMm: [[10, 12, 15]], addedMeltMm: [[0, 2, 5]],
    };
    const { option, table } = sweepChart(result);
    expect((option as { series: { type: string; data: number[][] }[] }).series[0].data).toEqual([[0, 0], [1, 2], [2, 5]]);
    expect(table.rows).toHaveLength(3);
  });
});
