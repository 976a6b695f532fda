/**
 * The one place ECharts parts are registered: only the chart types and components the charts use,
 * so the bundle stays small. Imported by BaseChart only, which keeps ECharts out of the entry chunk.
 */
import { use, init, registerTheme } from 'echarts/core';
import { DARK_CHART_THEME, DARK_CHART_THEME_NAME } from '@shared/charts/chart-style';
import { BarChart, HeatmapChart, LineChart, ScatterChart } from 'echarts/charts';
import {
  DataZoomComponent, GridComponent, LegendComponent, MarkLineComponent, MarkPointComponent, TooltipComponent, VisualMapComponent,
} from 'echarts/components';
import { CanvasRenderer } from 'echarts/renderers';

use([
  LineChart, BarChart, HeatmapChart, ScatterChart, GridComponent, TooltipComponent, LegendComponent, DataZoomComponent,
  MarkLineComponent, MarkPointComponent, VisualMapComponent, CanvasRenderer,
]);

// Dark mode's own chart theme (legend, axes, grid, tooltip); downloads and PDFs stay on white.
registerTheme(DARK_CHART_THEME_NAME, DARK_CHART_THEME);

/** Browser tests set this flag so screenshots show the final frame. */
export const chartsAnimated = !(globalThis as { __TARNISH_NO_ANIMATION__?: boolean }).__TARNISH_NO_ANIMATION__;

/**
 * Renders an option off screen with the SVG renderer and returns the SVG text (for downloads). The
 * SVG renderer loads only then, so it is not part of a page's first load.
 */
export async function renderSvg(option: object, width: number, height: number): Promise<string> {
  // The installer itself (not echarts/renderers, which the canvas renderer keeps in the page's first load).
  const { install } = await import('echarts/lib/renderer/installSVGRenderer.js');
  use([install]);
  const holder = document.createElement('div');
  const chart = init(holder, undefined, { renderer: 'svg', ssr: true, width, height });
  try {
    chart.setOption({ ...option, animation: false });
    return chart.renderToSVGString();
  } finally {
    chart.dispose();
  }
}

/** Renders an option off screen on a canvas and returns a PNG data URL: downloads work from the table view too. */
export function renderPng(option: object, width: number, height: number, pixelRatio = 2): string {
  const holder = document.createElement('div');
  const chart = init(holder, undefined, { renderer: 'canvas', width, height, devicePixelRatio: pixelRatio });
  try {
    chart.setOption({ ...option, animation: false, backgroundColor: '#ffffff' });
    return chart.getDataURL({ type: 'png', pixelRatio, backgroundColor: '#ffffff' });
  } finally {
    chart.dispose();
  }
}
