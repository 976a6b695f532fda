import { describe, expect, it } from 'vitest';
import { briefingComparison } from '../../../tests/fixtures/briefing-comparison';
import type { ComparisonForBriefing } from './comparison';
import { headlineOf, resultChart, resultTable } from './result-views';

/** The fixture's first run with an invented 5–95 % ensemble spread around its totals. */
function withEnsemble(c: ComparisonForBriefing): ComparisonForBriefing {
  const r = structuredClone(c.runs[0].results);
  const around = (x: number) => ({ p5: x * 0.8, p50: x, p95: x * 1.25 });
  const q = r.dischargeM3s.variant;
  r.ensemble = {
    size: 20,
    dischargeM3s: { p5: q.map((x) => x * 0.9), p50: q, p95: q.map((x) => x * 1.1) },
    addedDischargeM3s: { p5: q.map(() => 0), p50: q.map(() => 0), p95: q.map(() => 0) },
    totals: {
      addedVolumeM3: around(r.totals.addedVolumeM3),
      addedShareOfBaselineRunoff: around(r.totals.addedShareOfBaselineRunoff),
      meanAddedDischargeM3s: around(r.totals.meanAddedDischargeM3s),
      timingShiftDays: around(r.totals.timingShiftDays ?? 0),
    },
    note: null,
  };
  return { ...c, runs: [{ ...c.runs[0], results: r }] };
}

describe('briefing result views', () => {
  const plain = briefingComparison();

  it('gives headline numbers without ranges when there is no ensemble', () => {
    const h = headlineOf(plain.runs[0].results);
    expect(h.addedVolumeM3).toEqual({ value: plain.runs[0].results.totals.addedVolumeM3, low: null, high: null });
    expect(h.meltSeason).toMatch(/^\d{4}-\d{2}-\d{2} to \d{4}-\d{2}-\d{2}$/);
  });

  it('takes ranges from the ensemble percentiles, share of runoff in per cent', () => {
    const c = withEnsemble(plain);
    const r = c.runs[0].results;
    const h = headlineOf(r);
    expect(h.addedVolumeM3.low).toBeCloseTo(r.totals.addedVolumeM3 * 0.8, 6);
    expect(h.addedVolumeM3.high).toBeCloseTo(r.totals.addedVolumeM3 * 1.25, 6);
    expect(h.addedRunoffPercentOfBaseline.high).toBeCloseTo(r.totals.addedShareOfBaselineRunoff * 125, 6);
    const daily = resultChart('daily-discharge', c);
    expect(daily.series[1].low).toHaveLength(r.dayCount);
    const totals = resultTable('totals', c);
    expect(totals.rows[0].slice(1, 4)).toEqual([r.totals.addedVolumeM3 / 1e6, r.totals.addedVolumeM3 * 0.8 / 1e6, r.totals.addedVolumeM3 * 1.25 / 1e6].map((x) => Number(x.toFixed(3))));
  });

  it('splits added melt by surface so that the parts add up to the band totals', () => {
    const r = plain.runs[0].results;
    const split = resultChart('surface-split', plain).series[0].values as number[];
    const fromBands = r.bandAddedMm.reduce((s, b, i) => s + ((b.snow + b.ice + b.debrisIce) * r.bands[i].areaM2) / 1000, 0) / 1e6;
    expect(split.reduce((a, b) => a + b, 0)).toBeCloseTo(fromBands, 3);
  });

  it('labels bands by mean elevation and months by calendar month', () => {
    expect(resultChart('band-added-melt', plain).categories[0]).toMatch(/^[\d,]+ m$/);
    expect(resultChart('monthly-added-melt', plain).categories[0]).toBe('2022-10');
  });
});
