/**
 * The one place ECharts parts are registered. What every chart has (line and bar series, grid,
 * tooltip, plain legend, the canvas renderer) registers here; the rest loads the first time an
 * option needs it (shared/charts/chart-parts.ts), so a page downloads only the chart code it draws
 * with. Loaded by BaseChartCanvas and the downloads only, after the page itself has been drawn.
 */
import { use, init, registerTheme, type EChartsCoreOption } from 'echarts/core';
// Each installer from its own module, not from the echarts/charts or echarts/components index:
// the build puts what this file imports statically into the chart chunk (vite.config.ts).
import { install as LineChart } from 'echarts/lib/chart/line/install.js';
import { install as BarChart } from 'echarts/lib/chart/bar/install.js';
import { install as GridComponent } from 'echarts/lib/component/grid/install.js';
import { install as TooltipComponent } from 'echarts/lib/component/tooltip/install.js';
import { install as LegendPlainComponent } from 'echarts/lib/component/legend/installLegendPlain.js';
import { install as CanvasRenderer } from 'echarts/lib/renderer/installCanvasRenderer.js';
import { extraChartParts, type ExtraChartPart } from '@shared/charts/chart-parts';
import { DARK_CHART_THEME, DARK_CHART_THEME_NAME } from '@shared/charts/chart-style';

use([LineChart, BarChart, GridComponent, TooltipComponent, LegendPlainComponent, CanvasRenderer]);

// Dark mode's own chart theme (legend, axes, grid, tooltip); downloads and PDFs stay on white.
registerTheme(DARK_CHART_THEME_NAME, DARK_CHART_THEME);

type Installer = Parameters<typeof use>[0];
/** The parts only some charts draw with, each a chunk of its own. */
const EXTRA_PARTS: Record<ExtraChartPart, () => Promise<{ install: Installer }>> = {
  scatter: () => import('echarts/lib/chart/scatter/install.js'),
  heatmap: () => import('echarts/lib/chart/heatmap/install.js'),
  markLine: () => import('echarts/lib/component/marker/installMarkLine.js'),
  markPoint: () => import('echarts/lib/component/marker/installMarkPoint.js'),
  markArea: () => import('echarts/lib/component/marker/installMarkArea.js'),
  dataZoomInside: () => import('echarts/lib/component/dataZoom/installDataZoomInside.js'),
  dataZoomSlider: () => import('echarts/lib/component/dataZoom/installDataZoomSlider.js'),
  legendScroll: () => import('echarts/lib/component/legend/installLegendScroll.js'),
  visualMapContinuous: () => import('echarts/lib/component/visualMap/installVisualMapContinuous.js'),
  visualMapPiecewise: () => import('echarts/lib/component/visualMap/installVisualMapPiecewise.js'),
};
const installed = new Map<ExtraChartPart, Promise<void>>();

/** Resolves once every part `option` draws with is registered (each is fetched once per page load). */
export async function loadChartParts(option: EChartsCoreOption): Promise<void> {
  await Promise.all(extraChartParts(option as Record<string, unknown>).map((part) => {
    let done = installed.get(part);
    if (!done) {
      done = EXTRA_PARTS[part]().then(({ install }) => use(install));
      installed.set(part, done);
    }
    return done;
  }));
}

/** Browser tests set this flag so screenshots show the final frame. */
export const chartsAnimated = !(globalThis as { __TARNISH_NO_ANIMATION__?: boolean }).__TARNISH_NO_ANIMATION__;

/**
 * Renders an option off screen with the SVG renderer and returns the SVG text (for downloads). The
 * SVG renderer loads only then, so it is not part of a page's first load.
 */
export async function renderSvg(option: EChartsCoreOption, width: number, height: number): Promise<string> {
  const [{ install }] = await Promise.all([import('echarts/lib/renderer/installSVGRenderer.js'), loadChartParts(option)]);
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
export async function renderPng(option: EChartsCoreOption, width: number, height: number, pixelRatio = 2): Promise<string> {
  await loadChartParts(option);
  const holder = document.createElement('div');
  const chart = init(holder, undefined, { renderer: 'canvas', width, height, devicePixelRatio: pixelRatio });
  try {
    chart.setOption({ ...option, animation: false, backgroundColor: '#ffffff' });
    return chart.getDataURL({ type: 'png', pixelRatio, backgroundColor: '#ffffff' });
  } finally {
    chart.dispose();
  }
}
