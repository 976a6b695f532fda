/**
 * The one place ECharts parts are registered: only the chart types and components the charts use,
 * so the bundle stays small. Imported by BaseChart only, which keeps ECharts out of the entry chunk.
 */
import { use, init } from 'echarts/core';
import { BarChart, HeatmapChart, LineChart, ScatterChart } from 'echarts/charts';
import {
  DataZoomComponent, GridComponent, LegendComponent, MarkLineComponent, MarkPointComponent, TooltipComponent, VisualMapComponent,
} from 'echarts/components';
import { CanvasRenderer, SVGRenderer } from 'echarts/renderers';

use([
  LineChart, BarChart, HeatmapChart, ScatterChart, GridComponent, TooltipComponent, LegendComponent, DataZoomComponent,
  MarkLineComponent, MarkPointComponent, VisualMapComponent, CanvasRenderer, SVGRenderer,
]);

/** Browser tests set this flag so screenshots show the final frame. */
export const chartsAnimated = !(globalThis as { __TARNISH_NO_ANIMATION__?: boolean }).__TARNISH_NO_ANIMATION__;

/** Renders an option off screen with the SVG renderer and returns the SVG text (for downloads). */
export function renderSvg(option: object, width: number, height: number): string {
  const holder = document.createElement('div');
  const chart = init(holder, undefined, { renderer: 'svg', ssr: true, width, height });
  try {
    chart.setOption({ ...option, animation: false });
    return chart.renderToSVGString();
  } finally {
    chart.dispose();
  }
}
