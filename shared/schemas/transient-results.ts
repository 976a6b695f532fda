import { z } from 'zod';
import { runSetUpSchema } from './results';
import { runSchema } from './runs';

const numbers = z.array(z.number());
const bySource = z.object({ snow: numbers, ice: numbers, debrisIce: numbers, rain: numbers });

/** One simulation of a multi-decade run, year by year (values at the start of each year for the glacier, over the year for the rest). */
export const transientSeriesSchema = z.object({
  glacierAreaKm2: numbers,
  glacierVolumeKm3: numbers,
  /** Glacier-wide balance, mm w.e. over the glacier area. */
  massBalanceMm: numbers,
  /** Annual runoff by source as it leaves the bands, m³. */
  runoffM3: bySource,
  /** Melt and rain from the initially glacierised area (Huss & Hock 2018), m³. */
  glacierRunoffM3: numbers,
  /** Centred 11-year mean of the glacier runoff, m³; null where the window is not full. */
  smoothedGlacierRunoffM3: z.array(z.number().nullable()),
  peakWater: z.object({
    year: z.number().int().nullable(),
    valueM3: z.number().nullable(),
    status: z.enum(['reached', 'at or before the start', 'not reached', 'too short']),
    /** In words, e.g. "2041" or "not reached by 2074". */
    text: z.string(),
  }),
  /** Glacier area per band in the first and the last year, km². */
  bandGlacierAreaKm2: z.object({ first: numbers, last: numbers }),
  /** Glacier volume after the last year, km³. */
  finalVolumeKm3: z.number(),
});
export type TransientSeries = z.infer<typeof transientSeriesSchema>;

/** What a multi-decade run shows: the glacier and its runoff year by year, for the baseline and the variant, with peak water. */
export const transientResultsSchema = z.object({
  run: runSchema,
  catchmentName: z.string(),
  years: z.array(z.number().int()),
  recordYears: z.array(z.number().int()),
  /** Global warming above 1850–1900 (°C), the temperature change applied to the record (°C) and the precipitation factor, per year. */
  globalWarmingC: numbers,
  temperatureDeltaC: numbers,
  precipitationFactor: numbers,
  bands: z.array(z.object({ elevationM: z.number(), areaM2: z.number() })),
  baseline: transientSeriesSchema,
  variant: transientSeriesSchema,
  totals: z.object({
    /** Variant's peak-water year minus the baseline's; null unless both are reached. */
    peakWaterShiftYears: z.number().int().nullable(),
    /** Extra glacier runoff of the variant over the whole run, m³ (ice drawn down, not new water). */
    extraGlacierRunoffM3: z.number(),
    /** Glacier volume left at the end: baseline minus variant, km³ (the ice the darkening drew down earlier). */
    iceDrawnDownKm3: z.number(),
    /** Glacier area lost over the run, % of the initial area. */
    areaLossPercent: z.object({ baseline: z.number(), variant: z.number() }),
  }),
  /** The findings in plain sentences. */
  findings: z.array(z.string()),
  setUp: runSetUpSchema,
  cautions: z.array(z.string()),
});
export type TransientResults = z.infer<typeof transientResultsSchema>;
export const transientResultsReplySchema = z.object({ results: transientResultsSchema });
