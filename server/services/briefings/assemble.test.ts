import { describe, expect, it } from 'vitest';
import { CAUTIONS, ICE_DARKENING_CAUTION } from '../../../shared/text/cautions';
import { briefingComparison } from '../../../tests/fixtures/briefing-comparison';
import { testSnapshot } from '../../../tests/fixtures/briefing-snapshot';

describe('assembleSnapshot', () => {
  const s = testSnapshot();

  it('freezes one headline per variant, sections in draft order and the cautions last', () => {
    expect(s.headlines.map((h) => h.variantName)).toEqual(['Black carbon 150 ng/g', 'Dust and +2 °C']);
    expect(s.sections.map((x) => x.heading)[0]).toBe('What we looked at');
    expect(s.sections).toHaveLength(10);
    // The first variant darkens bare ice: its sensitivity caution follows the standard ones.
    expect(s.cautions).toEqual([...CAUTIONS, ICE_DARKENING_CAUTION]);
  });

  it('warns above the numbers when a run is not calibrated, and freezes each run\'s set-up', () => {
    expect(s.warnings).toHaveLength(2);
    expect(s.warnings[0]).toMatch(/^Black carbon 150 ng\/g: Not calibrated/);
    expect(s.assumptions.setUp.map((r) => r.lines.map((l) => l.label))[0]).toEqual(['Calibration', 'Start', 'Incoming shortwave', 'Baseline against observed discharge']);
    expect(s.assumptions.setUp[0].lines[1].value).toMatch(/^Spun up through the 365 days before the period/);
  });

  it('charts the added runoff per month; the months add up to the run\'s season total', () => {
    const chart = s.sections.find((x) => x.kind === 'chart' && x.heading === 'Added melt by month');
    if (chart?.kind !== 'chart') throw new Error('chart missing');
    expect(chart.chart.categories).toHaveLength(12);
    const total = chart.chart.series[0].values.reduce((a: number, b) => a + (b ?? 0), 0);
    const cumulative = briefingComparison().runs[0].results.cumulativeAddedM3;
    // Rounded per month to 100 m³, so agree to about a thousand m³.
    expect(total * 1e6).toBeCloseTo(cumulative[cumulative.length - 1], -3);
  });

  it('takes headline numbers from the run totals, share of runoff as a percentage', () => {
    const totals = briefingComparison().runs[0].results.totals;
    expect(s.headlines[0].addedVolumeM3.value).toBe(totals.addedVolumeM3);
    expect(s.headlines[0].addedRunoffPercentOfBaseline.value).toBeCloseTo(totals.addedShareOfBaselineRunoff * 100, 10);
    expect(s.headlines[0].addedVolumeM3.low).toBeNull();
  });

  it('records engine version and input hash of every run, and the data sources with their accuracy', () => {
    expect(s.assumptions.runs.map((r) => r.inputHash)).toHaveLength(2);
    expect(s.assumptions.scenarios.map((x) => x.role)).toEqual(['baseline', 'variant', 'variant']);
    expect(s.assumptions.engineVersion).toMatch(/^\d+\.\d+\.\d+/);
    expect(s.assumptions.dataSources[0].accuracy).toContain('±');
  });

  it('is a deep copy: changing the source afterwards leaves it alone', () => {
    const before = JSON.stringify(s);
    const again = testSnapshot();
    (again.headlines[0].addedVolumeM3 as { value: number }).value = -1;
    expect(JSON.stringify(s)).toBe(before);
  });
});
