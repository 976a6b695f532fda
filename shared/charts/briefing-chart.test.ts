import { describe, expect, it } from 'vitest';
import type { ChartData } from '../schemas/briefings';
import { briefingChartOption } from './briefing-chart';

type Axis = { axisLabel: { interval?: number; rotate?: number; formatter(value: string): string } };
const xAxisOf = (chart: ChartData) => briefingChartOption(chart).xAxis as Axis;

const bars = (categories: string[]): ChartData => ({
  type: 'bar', xName: 'Catchment', yName: 'Added runoff', unit: 'million m³', categories,
  series: [{ name: 'Soot', values: categories.map((_, i) => i + 1) }],
});

describe('briefing chart option', () => {
  it('names every bar, slanting long names such as catchments\'', () => {
    const catchments = xAxisOf(bars(['Upper Sarvel glacier catchment', 'Kolvi side valley', 'Tashgar glacier catchment', 'Orvan headwater', 'Munel cirques']));
    expect(catchments.axisLabel).toMatchObject({ interval: 0, rotate: 25 });
    const months = xAxisOf(bars(['2024-05', '2024-06', '2024-07']));
    expect(months.axisLabel).toMatchObject({ interval: 0 });
    expect(months.axisLabel.rotate).toBeUndefined();
  });

  it('leaves a daily line to ECharts\' own label spacing, its days written as dates', () => {
    const days = Array.from({ length: 120 }, (_, d) => new Date(Date.UTC(2024, 4, 1 + d)).toISOString().slice(0, 10));
    const line: ChartData = { ...bars(days), type: 'line', xName: 'Date' };
    const { axisLabel } = xAxisOf(line);
    expect(axisLabel.interval).toBeUndefined();
    expect(axisLabel.formatter(days[0])).toBe('1 May 2024');
    // Months read as months, names as they are.
    expect([axisLabel.formatter('2024-05'), axisLabel.formatter('Kolvi side valley')]).toEqual(['May 2024', 'Kolvi side valley']);
  });
});
