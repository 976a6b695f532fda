import { describe, expect, it } from 'vitest';
import { forDarkCard } from './chart-style';
import { GUIDE_GREY, INK, lineStyle, REFERENCE_GREY, seriesColour } from './palette';

describe('charts on the dark card', () => {
  it('lighten the black and grey inks of observations, baselines and guides, and leave series colours and data alone', () => {
    const values = new Float64Array([1, 2, 3]);
    const option = {
      series: [
        { name: 'Observed', type: 'line', itemStyle: { color: INK }, data: [[0, 1], [1, 2]] },
        { name: 'Baseline', type: 'line', ...lineStyle(0, true), data: values },
        { name: 'Variant', type: 'line', ...lineStyle(1) },
        { name: '1:1', type: 'line', lineStyle: { type: 'dashed', color: GUIDE_GREY }, data: [{ value: 2, itemStyle: { color: INK } }] },
      ],
    };
    type Drawn = { itemStyle?: { color: string }; lineStyle?: { color: string }; data?: unknown };
    const [observed, baseline, variant, guide] = (forDarkCard(option) as { series: Drawn[] }).series;
    const lightInk = observed.itemStyle!.color;
    expect(lightInk).not.toBe(INK);
    expect(baseline.lineStyle!.color).not.toBe(REFERENCE_GREY);
    expect(guide.lineStyle!.color).not.toBe(GUIDE_GREY);
    expect((guide.data as { itemStyle: { color: string } }[])[0].itemStyle.color).toBe(lightInk);
    expect(variant.lineStyle!.color).toBe(seriesColour(1));
    // Pairs of numbers are the option's own, not copies.
    expect((observed.data as number[][])[1]).toBe(option.series[0].data![1]);
    expect(baseline.data).toBe(values);
    // The light option, which downloads and PDFs draw, is untouched.
    expect(option.series[0].itemStyle!.color).toBe(INK);
  });
});
