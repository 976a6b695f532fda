import { addDays } from '../melt/calendar';
import { dailyMeltM3, dailyRunoffM3, type SimulationSummary } from './simulation-summary';

/** The figures of the totals table for one variant against the baseline. */
export interface AddedMeltTotals {
  /** Added runoff over the period as a depth over the whole catchment, mm w.e. */
  addedDepthMm: number;
  addedVolumeM3: number;
  addedVolumeMillionM3: number;
  /** Mean added discharge over the melt season (see meltSeason), m³ s⁻¹. */
  meanAddedDischargeM3s: number;
  /** Added runoff as a fraction of the baseline's runoff over the period ("added runoff, % of baseline"; can exceed 1). */
  addedShareOfBaselineRunoff: number;
  /** Added runoff as a fraction of the variant's own runoff over the period (below 1). */
  addedShareOfVariantRunoff: number;
  /** Date by which half of the period's melt has run off; null without melt. */
  baselineHalfMeltDate: string | null;
  variantHalfMeltDate: string | null;
  /** Variant minus baseline, days; negative = earlier. */
  timingShiftDays: number | null;
  /** Mean extra shortwave absorbed by snow and ice, area- and day-weighted over bands, W m⁻². */
  meanExtraAbsorbedShortwaveWm2: number;
  /** The melt season: from the day 5 % to the day 95 % of the baseline's melt had run off. */
  meltSeason: { from: string; to: string } | null;
}

const sum = (values: readonly number[]) => values.reduce((a, b) => a + b, 0);

/** Index of the first day by which `share` of the series' total has accumulated; −1 if the total is 0. */
export function dayByShare(daily: readonly number[], share: number): number {
  const total = sum(daily);
  if (!(total > 0)) return -1;
  let acc = 0;
  for (let d = 0; d < daily.length; d++) {
    acc += daily[d];
    if (acc >= share * total) return d;
  }
  return daily.length - 1;
}

function assertSameShape(baseline: SimulationSummary, variant: SimulationSummary): void {
  if (baseline.startDate !== variant.startDate || baseline.dayCount !== variant.dayCount || baseline.bands.length !== variant.bands.length) {
    throw new RangeError('addedMeltTotals: baseline and variant must cover the same days and bands');
  }
}

function meanAbsorbedWm2(summary: SimulationSummary): number {
  let weighted = 0;
  let weight = 0;
  for (const row of summary.months) {
    const w = summary.bands[row.bandIndex].areaM2 * row.days;
    weighted += row.absorbedShortwaveWm2 * w;
    weight += w;
  }
  return weight > 0 ? weighted / weight : 0;
}

export function addedMeltTotals(baseline: SimulationSummary, variant: SimulationSummary): AddedMeltTotals {
  assertSameShape(baseline, variant);
  const base = dailyRunoffM3(baseline);
  const vari = dailyRunoffM3(variant);
  const added = vari.map((v, d) => v - base[d]);
  const areaM2 = sum(baseline.bands.map((b) => b.areaM2));
  const addedVolumeM3 = sum(added);
  const baseMelt = dailyMeltM3(baseline);
  const from = dayByShare(baseMelt, 0.05);
  const to = dayByShare(baseMelt, 0.95);
  const seasonAdded = from < 0 ? 0 : sum(added.slice(from, to + 1));
  const baseHalf = dayByShare(baseMelt, 0.5);
  const variHalf = dayByShare(dailyMeltM3(variant), 0.5);
  const date = (d: number) => (d < 0 ? null : addDays(baseline.startDate, d));
  const baseRunoff = sum(base);
  return {
    addedDepthMm: areaM2 > 0 ? (addedVolumeM3 / areaM2) * 1000 : 0,
    addedVolumeM3,
    addedVolumeMillionM3: addedVolumeM3 / 1e6,
    meanAddedDischargeM3s: from < 0 ? 0 : seasonAdded / ((to - from + 1) * 86400),
    addedShareOfBaselineRunoff: baseRunoff > 0 ? addedVolumeM3 / baseRunoff : 0,
    addedShareOfVariantRunoff: sum(vari) > 0 ? addedVolumeM3 / sum(vari) : 0,
    baselineHalfMeltDate: date(baseHalf),
    variantHalfMeltDate: date(variHalf),
    timingShiftDays: baseHalf < 0 || variHalf < 0 ? null : variHalf - baseHalf,
    meanExtraAbsorbedShortwaveWm2: meanAbsorbedWm2(variant) - meanAbsorbedWm2(baseline),
    meltSeason: from < 0 ? null : { from: date(from)!, to: date(to)! },
  };
}
