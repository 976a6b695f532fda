import { mount } from '@vue/test-utils';
import { Quasar } from 'quasar';
import { describe, expect, it, vi } from 'vitest';
import type * as DownloadModule from 'src/composables/useDownload';
import BaseChart from './BaseChart.vue';

vi.mock('vue-echarts', () => ({ default: { name: 'Echarts', props: ['option', 'autoresize'], template: '<div class="chart-stub" />' } }));
const loadChartParts = vi.hoisted(() => vi.fn(() => Promise.resolve()));
vi.mock('src/boot/echarts', () => ({
  chartsAnimated: false, loadChartParts, renderSvg: () => Promise.resolve('<svg />'), renderPng: () => Promise.resolve('data:image/png;base64,'),
}));
const saved = vi.hoisted(() => [] as { text: string; fileName: string }[]);
vi.mock('src/composables/useDownload', async (original) => ({
  ...(await original<typeof DownloadModule>()),
  downloadText: (text: string, fileName: string) => saved.push({ text, fileName }),
}));

const table = {
  columns: [{ name: 'time', label: 'Time' }, { name: 'value', label: 'Temperature (°C)' }],
  rows: [{ time: '2024-01-01 00:00', value: -3.5 }, { time: '2024-01-01 01:00', value: null }] as { time: string; value: number | null }[],
};

function mountChart() {
  return mount(BaseChart, {
    props: { title: 'Air temperature', option: { series: [] }, table, fileName: 'temperature' },
    global: { plugins: [Quasar] },
  });
}

describe('BaseChart', () => {
  it('shows the chart first and the same numbers as a table on request, gaps as empty cells', async () => {
    const wrapper = mountChart();
    // The chart's code loads after the card is drawn.
    await vi.waitFor(() => expect(wrapper.find('.chart-stub').exists()).toBe(true));
    const tableButton = wrapper.findAll('button').find((b) => b.text() === 'Table')!;
    await tableButton.trigger('click');
    expect(wrapper.find('.chart-stub').exists()).toBe(false);
    await vi.waitFor(() => expect(wrapper.find('tbody').exists()).toBe(true));
    // Virtual scrolling adds one-cell spacer rows around the data rows.
    const cells = wrapper.findAll('tbody tr').map((tr) => tr.findAll('td').map((td) => td.text())).filter((row) => row.length === 2);
    expect(cells).toEqual([['2024-01-01 00:00', '−3.5'], ['2024-01-01 01:00', '']]);
  });

  it('downloads the table as CSV with formula-like text escaped', async () => {
    const wrapper = mount(BaseChart, {
      props: { title: 'Stakes', option: {}, fileName: 'stakes', table: { columns: [{ name: 'stake', label: 'Stake' }], rows: [{ stake: '=HYPERLINK("x")' }] } },
      global: { plugins: [Quasar] },
    });
    (wrapper.vm as unknown as { downloadTable(): void }).downloadTable();
    // With the byte-order mark every CSV download carries (units such as °C read right in spreadsheets).
    expect(saved.at(-1)).toEqual({ fileName: 'stakes.csv', text: '\uFEFFStake\r\n"\'=HYPERLINK(""x"")"\r\n' });
  });

  it('says so when the chart\'s code cannot load, and points to the table view', async () => {
    loadChartParts.mockRejectedValueOnce(new Error('Failed to fetch dynamically imported module'));
    const errors: unknown[] = [];
    const wrapper = mount(BaseChart, {
      props: { title: 'Air temperature', option: { series: [] }, table, fileName: 'temperature' },
      global: { plugins: [Quasar], config: { errorHandler: (error) => errors.push(error) } },
    });
    await vi.waitFor(() => expect(wrapper.text()).toContain('the table view has its numbers'));
    expect(wrapper.find('.chart-stub').exists()).toBe(false);
    expect(errors).toHaveLength(1);
  });
});
