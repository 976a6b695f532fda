import { z } from 'zod';
import { runSchema } from './runs';

const numbers = z.array(z.number());
const range = z.object({ p5: z.number(), p50: z.number(), p95: z.number() });

export const totalsSchema = z.object({
  addedDepthMm: z.number(),
  addedVolumeM3: z.number(),
  addedVolumeMillionM3: z.number(),
  meanAddedDischargeM3s: z.number(),
  addedShareOfBaselineRunoff: z.number(),
  addedShareOfVariantRunoff: z.number(),
  baselineHalfMeltDate: z.string().nullable(),
  variantHalfMeltDate: z.string().nullable(),
  timingShiftDays: z.number().nullable(),
  meanExtraAbsorbedShortwaveWm2: z.number(),
  meltSeason: z.object({ from: z.string(), to: z.string() }).nullable(),
});
export type Totals = z.infer<typeof totalsSchema>;

/** Figures of the totals table that get a 5–95 % range from an ensemble. */
export const RANGED_TOTALS = ['addedDepthMm', 'addedVolumeM3', 'meanAddedDischargeM3s', 'addedShareOfBaselineRunoff', 'meanExtraAbsorbedShortwaveWm2', 'timingShiftDays'] as const;

/** How a run was set up, checked and scored: what a reviewer asks before trusting the added melt. */
export const runSetUpSchema = z.object({
  /** Null for runs made before engine 2.0. */
  start: z.object({ label: z.string(), note: z.string(), adequate: z.boolean() }).nullable(),
  shortwaveSource: z.string().nullable(),
  calibration: z.object({ status: z.enum(['calibrated', 'differs', 'uncalibrated']), message: z.string() }),
  /** The baseline's daily discharge against the catchment's observed discharge over the period; null without observations. */
  skill: z.object({
    kge: z.number(), r: z.number(), alpha: z.number(), beta: z.number(), nse: z.number(), biasPercent: z.number(),
    days: z.number().int(), from: z.string(), to: z.string(), source: z.string(),
    /** Whether the scored discharge was routed to the outlet (else the day's melt and rain). */
    routed: z.boolean().default(false),
  }).nullable(),
  /** The catchment's water side the run was simulated with (runs made before it was recorded have none). */
  waterSide: z.array(z.object({ label: z.string(), value: z.string() })).default([]),
});
export type RunSetUp = z.infer<typeof runSetUpSchema>;

/** Where the water went over the period, mm w.e. averaged over the catchment. */
export const waterBalanceSchema = z.object({
  snowfallMm: z.number(), rainfallMm: z.number(), surfaceMeltMm: z.number(), refrozenMm: z.number(),
  sublimationMm: z.number(), evaporationMm: z.number(), runoffMm: z.number(),
});
export type WaterBalance = z.infer<typeof waterBalanceSchema>;

const bySource = z.object({ snow: z.number(), ice: z.number(), debrisIce: z.number(), rain: z.number() });

/** Everything the results screens and exports show for one run (variant minus its paired baseline). */
export const runResultsSchema = z.object({
  run: runSchema,
  catchmentName: z.string(),
  startDate: z.string(),
  dayCount: z.number().int(),
  bands: z.array(z.object({ elevationM: z.number(), areaM2: z.number() })),
  totals: totalsSchema,
  setUp: runSetUpSchema,
  waterBalance: z.object({ baseline: waterBalanceSchema, variant: waterBalanceSchema }),
  /** Daily mean runoff as it leaves the bands (all melt and rain, unrouted), m³ s⁻¹. */
  dischargeM3s: z.object({ baseline: numbers, variant: numbers }),
  /** Daily mean discharge at the outlet, routed through the catchment's stores; null when the run did not route. */
  outletDischargeM3s: z.object({ baseline: numbers, variant: numbers }).nullable().default(null),
  /** Snow each band gained (+) or lost (−) over the period by wind drift and avalanching, mm w.e. over the band; null when neither was on. */
  bandRedistributionMm: z.object({
    baseline: z.array(z.object({ windDrift: z.number(), avalanche: z.number() })),
    variant: z.array(z.object({ windDrift: z.number(), avalanche: z.number() })),
  }).nullable().default(null),
  /** Cumulative added runoff volume through the period, m³. */
  cumulativeAddedM3: numbers,
  /** Added melt over the period per band by source, mm w.e. over the band. */
  bandAddedMm: z.array(bySource),
  months: z.array(z.string()),
  /** Per band (outer) and month (inner); null when the band had no sunlit snow or ice. */
  albedo: z.object({ baseline: z.array(z.array(z.number().nullable())), variant: z.array(z.array(z.number().nullable())) }),
  /** Area-weighted catchment means per month, W m⁻². */
  energy: z.object({
    baseline: z.object({ netShortwave: numbers, netLongwave: numbers, sensibleHeat: numbers }),
    variant: z.object({ netShortwave: numbers, netLongwave: numbers, sensibleHeat: numbers }),
  }),
  attribution: z.object({
    terms: z.array(z.object({ label: z.string(), mask: z.number().int(), drivers: z.number().int(), addedVolumeM3: z.number(), addedDepthMm: z.number() })),
    fullChangeM3: z.number(),
  }).nullable(),
  ensemble: z.object({
    size: z.number().int(),
    dischargeM3s: z.object({ p5: numbers, p50: numbers, p95: numbers }),
    addedDischargeM3s: z.object({ p5: numbers, p50: numbers, p95: numbers }),
    totals: z.record(z.string(), range),
    /** Why the central run lies outside the 5–95 % range of added runoff, when it does. */
    note: z.string().nullable(),
  }).nullable(),
  cautions: z.array(z.string()),
});
export type RunResults = z.infer<typeof runResultsSchema>;
export const runResultsReplySchema = z.object({ results: runResultsSchema });
