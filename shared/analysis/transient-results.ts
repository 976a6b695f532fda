import { peakWater, type PeakWater } from '../hydrology/peak-water';
import { SOURCES } from '../melt/result';
import type { RunSetUp } from '../schemas/results';
import type { Run, TransientOptions } from '../schemas/runs';
import type { TransientResults, TransientSeries } from '../schemas/transient-results';
import { CAUTIONS, ICE_DARKENING_CAUTION } from '../text/cautions';
import { formatNumber } from '../text/numbers';
import type { MemberKind } from './run-plan';
import type { TransientSummary } from './transient-member';
import { OBSERVED_WARMING_C } from './warming-presets';
import type { GlacierSettings } from '../schemas/water-settings';

export interface TransientMember {
  kind: MemberKind;
  summary: Pick<TransientSummary, 'years' | 'bands'>;
}

/** Shown with every multi-decade run: how to read it, and what the glacier update leaves out. */
export const TRANSIENT_CAUTIONS: readonly string[] = [
  'Over decades, extra melt from darkening shows as ice drawn down earlier — peak water reached sooner and less glacier runoff afterwards — not as new water.',
  'Glacier area and thickness change once a year by the Δh-parameterisation (Huss et al. 2010), derived for retreating Alpine glaciers; the glacier never advances into bands without glacier, and the initial ice volume (volume–area scaling or given thicknesses) is uncertain by tens of percent.',
  'The scenario years reuse the station record\'s weather; year-to-year variability and trends other than the warming path are those of the record.',
];

const mcm = (m3: number) => `${formatNumber(m3 / 1e6, 1)} million m³`;

function peakText(p: PeakWater, years: readonly number[]): string {
  if (p.status === 'reached') return String(p.year);
  if (p.status === 'not reached') return `not reached by ${years.at(-1)}`;
  if (p.status === 'at or before the start') return `at or before ${years[0] + 5}`;
  return 'too short to tell';
}

function seriesOf(summary: TransientMember['summary']): TransientSeries {
  const y = summary.years;
  const years = y.map((r) => r.year);
  const glacierRunoff = y.map((r) => r.glacierRunoffM3);
  const peak = peakWater(years, glacierRunoff);
  const last = y.at(-1)!;
  return {
    glacierAreaKm2: y.map((r) => r.glacierAreaKm2),
    glacierVolumeKm3: y.map((r) => r.glacierVolumeKm3),
    massBalanceMm: y.map((r) => r.massBalanceMm),
    runoffM3: Object.fromEntries(SOURCES.map((s) => [s, y.map((r) => r.runoffM3[s])])) as TransientSeries['runoffM3'],
    glacierRunoffM3: glacierRunoff,
    smoothedGlacierRunoffM3: Array.from(peak.smoothed, (v) => (Number.isFinite(v) ? v : null)),
    peakWater: { year: peak.year, valueM3: peak.value, status: peak.status, text: peakText(peak, years) },
    bandGlacierAreaKm2: { first: y[0].bandGlacierAreaKm2, last: last.bandGlacierAreaKm2 },
    finalVolumeKm3: last.glacierVolumeKm3 + last.volumeChangeM3 / 1e9,
  };
}

/** How the glacier of a multi-decade run was initialised, in one line. */
export function initialGlacierLine(glacier: GlacierSettings, areaKm2: number, volumeKm3: number): { label: string; value: string } {
  const how = glacier.method === 'thickness'
    ? 'from the ice thickness given per band'
    : `by volume–area scaling V = c A^γ (Bahr et al. 1997; c ${formatNumber(glacier.coefficientKm, 3)}, γ ${formatNumber(glacier.exponent, 3)}) `
      + (glacier.glacierAreasKm2 ? `over ${glacier.glacierAreasKm2.length} glaciers` : 'as one glacier of the bands\' total area');
  return { label: 'Initial glacier', value: `${formatNumber(areaKm2, 1)} km² holding ${formatNumber(volumeKm3, 2)} km³ of ice, ${how}.` };
}

/** The warming path of a multi-decade run in one line, for its set-up. */
export function transientLine(options: TransientOptions, recordYears: readonly number[]): { label: string; value: string } {
  const last = options.fromYear + options.years - 1;
  const record = [...new Set(recordYears)].sort((a, b) => a - b);
  const local = (options.warmingLevelC - OBSERVED_WARMING_C) * options.regionalFactor;
  return {
    label: 'Multi-decade run',
    value: `${options.fromYear}–${last}: global warming rising from the record's ${formatNumber(OBSERVED_WARMING_C, 2)} °C to ${formatNumber(options.warmingLevelC, 1)} °C above 1850–1900 by ${options.targetYear} and held after `
      + `(IPCC AR6 warming levels), ${formatNumber(local, 2)} °C warmer locally at that level (regional factor ${formatNumber(options.regionalFactor, 2)}); `
      + `precipitation ${options.precipitationChangePercent >= 0 ? '+' : '−'}${formatNumber(Math.abs(options.precipitationChangePercent), 1)} % at that level; `
      + `weather of the record's mass-balance years ${record[0]}–${record.at(-1)} ${options.recordYears === 'repeat' ? 'repeated in order' : `resampled (seed ${options.seed})`}; `
      + 'glacier area and thickness updated every year by the Δh-parameterisation (Huss et al. 2010).',
  };
}

export interface TransientContext {
  setUp: RunSetUp;
  iceDarkened: boolean;
}

/** A finished multi-decade run's members as the results screen, exports and briefings show them. */
export function transientResults(run: Run, catchmentName: string, members: TransientMember[], context: TransientContext): TransientResults {
  const variantMember = members.find((m) => m.kind === 'scenario');
  if (!variantMember || !run.transient) throw new RangeError('transient results: the run has no multi-decade scenario member');
  const baselineMember = members.find((m) => m.kind === 'baseline') ?? variantMember;
  const rows = variantMember.summary.years;
  const baseline = seriesOf(baselineMember.summary);
  const variant = seriesOf(variantMember.summary);
  const sum = (v: readonly number[]) => v.reduce((a, b) => a + b, 0);
  const options = run.transient;
  const shift = baseline.peakWater.status === 'reached' && variant.peakWater.status === 'reached' ? variant.peakWater.year! - baseline.peakWater.year! : null;
  const lossPercent = (s: TransientSeries) => (s.glacierAreaKm2[0] > 0 ? (100 * (s.glacierAreaKm2[0] - s.glacierAreaKm2.at(-1)!)) / s.glacierAreaKm2[0] : 0);
  const extra = sum(variant.glacierRunoffM3) - sum(baseline.glacierRunoffM3);
  const isVariant = baselineMember !== variantMember;
  const findings = [
    `Glacier area ${formatNumber(baseline.glacierAreaKm2[0], 1)} km² in ${rows[0].year}, ${formatNumber(baseline.glacierAreaKm2.at(-1)!, 1)} km² in ${rows.at(-1)!.year} in the baseline`
      + (isVariant ? `, ${formatNumber(variant.glacierAreaKm2.at(-1)!, 1)} km² with ${run.scenarioName}.` : '.'),
    `Peak water (largest 11-year mean of glacier runoff): baseline ${baseline.peakWater.text}`
      + (isVariant ? `, ${run.scenarioName} ${variant.peakWater.text}${shift !== null ? ` (${shift === 0 ? 'the same year' : `${Math.abs(shift)} year${Math.abs(shift) === 1 ? '' : 's'} ${shift < 0 ? 'earlier' : 'later'}`})` : ''}.` : '.'),
    ...(isVariant ? [`Over the ${rows.length} years the darkening adds ${mcm(extra)} of glacier runoff and leaves ${formatNumber(baseline.finalVolumeKm3 - variant.finalVolumeKm3, 3)} km³ less ice: water drawn from the glacier earlier, not new water.`] : []),
  ];
  return {
    run, catchmentName,
    years: rows.map((r) => r.year),
    recordYears: rows.map((r) => r.recordYear),
    globalWarmingC: rows.map((r) => OBSERVED_WARMING_C + r.temperatureDeltaC / options.regionalFactor),
    temperatureDeltaC: rows.map((r) => r.temperatureDeltaC),
    precipitationFactor: rows.map((r) => r.precipitationFactor),
    bands: variantMember.summary.bands,
    baseline, variant,
    totals: {
      peakWaterShiftYears: shift, extraGlacierRunoffM3: extra, iceDrawnDownKm3: baseline.finalVolumeKm3 - variant.finalVolumeKm3,
      areaLossPercent: { baseline: lossPercent(baseline), variant: lossPercent(variant) },
    },
    findings,
    setUp: context.setUp,
    cautions: [...CAUTIONS, ...TRANSIENT_CAUTIONS, ...(context.iceDarkened ? [ICE_DARKENING_CAUTION] : [])],
  };
}
