import { z } from 'zod';
import { calibrationSetSchema, searchFacts, setReplySchema, skillScoresSchema } from './lab';

/** Skill against remote sensing with the given set, or the one in force. */
export const remoteSensingSkillRequestSchema = z.object({ set: calibrationSetSchema.optional() });
export type RemoteSensingSkillRequest = z.output<typeof remoteSensingSkillRequestSchema>;

export const snowCoverComparisonSchema = z.object({
  pairs: z.array(z.object({ date: z.string(), lowerM: z.number(), upperM: z.number(), snowCoveredFraction: z.number(), validFraction: z.number(), simulatedFraction: z.number() })),
  leftOut: z.number(),
  scores: skillScoresSchema.nullable(),
  meanError: z.number(),
  rmse: z.number(),
  agreement: z.number(),
});
export type SnowCoverComparisonReply = z.infer<typeof snowCoverComparisonSchema>;

export const geodeticComparisonSchema = z.object({
  period: z.object({ from: z.string(), to: z.string() }),
  periodsDiffer: z.boolean(),
  rows: z.array(z.object({
    fromDate: z.string(), toDate: z.string(), lowerM: z.number(), upperM: z.number(), glacierAreaKm2: z.number(),
    balanceMwePerYear: z.number(), sigmaMwePerYear: z.number(), simulatedMwePerYear: z.number(),
  })),
  leftOut: z.number(),
  glacierWide: z.object({ observedMwePerYear: z.number(), simulatedMwePerYear: z.number(), sigmaMwePerYear: z.number() }),
  scores: skillScoresSchema.nullable(),
  meanError: z.number(),
  rmse: z.number(),
  withinTwoSigma: z.number(),
});
export type GeodeticComparisonReply = z.infer<typeof geodeticComparisonSchema>;

export const snowCoverSkillReplySchema = z.object({ set: setReplySchema, comparison: snowCoverComparisonSchema });
export const geodeticSkillReplySchema = z.object({ set: setReplySchema, comparison: geodeticComparisonSchema });

/** What a calibration job against remote sensing ends with: the comparison before and after the search. */
export const remoteSensingCalibrationSchema = z.discriminatedUnion('target', [
  z.object({ target: z.literal('snowCover'), ...searchFacts, start: snowCoverComparisonSchema, result: snowCoverComparisonSchema }),
  z.object({ target: z.literal('geodetic'), ...searchFacts, start: geodeticComparisonSchema, result: geodeticComparisonSchema }),
]);
export type RemoteSensingCalibrationReply = z.infer<typeof remoteSensingCalibrationSchema>;
