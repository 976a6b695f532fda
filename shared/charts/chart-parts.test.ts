import { describe, expect, it } from 'vitest';
import { extraChartParts } from './chart-parts';
import { ZOOM } from './chart-spec';
import { wrappingLegend } from './chart-style';

describe('extraChartParts', () => {
  it('needs nothing more for line and bar series with a plain legend', () => {
    const option = { legend: wrappingLegend(['Baseline', 'Soot'], 390).legend, series: [{ type: 'line' }, { type: 'bar', stack: 'a' }] };
    expect(extraChartParts(option)).toEqual([]);
  });

  it('names each part once: scatter and heatmap series, markers on any series, zooms by type', () => {
    const option = {
      series: [
        { type: 'line', markLine: { data: [] } },
        { type: 'scatter', markPoint: { data: [] } },
        { type: 'scatter', markLine: { data: [] }, markArea: { data: [] } },
        { type: 'heatmap' },
      ],
      dataZoom: ZOOM,
    };
    expect(extraChartParts(option).sort()).toEqual(['dataZoomInside', 'dataZoomSlider', 'heatmap', 'markArea', 'markLine', 'markPoint', 'scatter']);
  });

  it('takes a component given alone as well as in a list, and a zoom without a type as a slider (as ECharts does)', () => {
    expect(extraChartParts({ dataZoom: {}, legend: { type: 'scroll' } }).sort()).toEqual(['dataZoomSlider', 'legendScroll']);
    expect(extraChartParts({ dataZoom: [{ type: 'inside' }] })).toEqual(['dataZoomInside']);
  });

  it('tells continuous from piecewise visual maps by the rule of ECharts\' type defaulter', () => {
    expect(extraChartParts({ visualMap: { min: 0, max: 100 } })).toEqual(['visualMapContinuous']);
    expect(extraChartParts({ visualMap: { min: 0, max: 100, splitNumber: 5 } })).toEqual(['visualMapPiecewise']);
    expect(extraChartParts({ visualMap: { min: 0, max: 100, splitNumber: 5, calculable: true } })).toEqual(['visualMapContinuous']);
    expect(extraChartParts({ visualMap: { pieces: [{ min: 0, max: 1 }] } })).toEqual(['visualMapPiecewise']);
    expect(extraChartParts({ visualMap: { pieces: [] } })).toEqual(['visualMapContinuous']);
    expect(extraChartParts({ visualMap: { categories: ['a'] } })).toEqual(['visualMapPiecewise']);
    expect(extraChartParts({ visualMap: { type: 'continuous', categories: ['a'] } })).toEqual(['visualMapContinuous']);
  });

  it('refuses a series type no part draws, naming it', () => {
    expect(() => extraChartParts({ series: [{ type: 'pie' }] })).toThrow(/series of type "pie"/);
  });
});
