import { calibrate } from '../../shared/lab/calibrate';
import type { ParameterRange } from '../../shared/lab/behavioural-ranges';
import { DEFAULT_CALIBRATION_SET, type CalibrationKey, type CalibrationSet } from '../../shared/lab/calibration-set';
import type { SkillScores } from '../../shared/lab/skill-scores';
import { demoEngineInput } from './demo-forcing';
import { demoObservations } from './demo-observations';

/** The season and parameters the demo is calibrated on, as a consultant would set the lab up. */
export const DEMO_CALIBRATION_SEASON = { from: '2023-04-01', to: '2023-09-30' };
export const DEMO_CALIBRATION_KEYS: CalibrationKey[] = ['lapseRateCPerKm', 'precipitationFactor'];

/** The lab's calibration of the demo against its synthetic discharge, with its scores and the parameters' behavioural ranges. */
export function calibrateDemo(): { set: CalibrationSet; kge: number; scores: { daily: SkillScores; monthly: SkillScores | null }; ranges: ParameterRange[] } {
  const site = demoEngineInput();
  const o = demoObservations();
  const observed = o.dailyDischarge.times.map((t, i) => ({ date: t.slice(0, 10), value: o.dailyDischarge.values[i] }));
  const found = calibrate(site, observed, { keys: DEMO_CALIBRATION_KEYS, period: DEMO_CALIBRATION_SEASON, start: DEFAULT_CALIBRATION_SET, maxEvaluations: 80, seed: 1 });
  return { set: found.set, kge: found.scores.daily.kge, scores: { daily: found.scores.daily, monthly: found.scores.monthly }, ranges: found.ranges };
}
