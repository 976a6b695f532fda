import type { CalibrationSet } from '../../shared/lab/calibration-set';
import type { SkillScores } from '../../shared/lab/skill-scores';

/**
 * The demo catchment's saved calibration, as the lab finds it from the demo's synthetic discharge
 * (regenerate with scripts/demo-calibration.ts; seeds/data/demo-calibrate.test.ts checks it).
 */
export const DEMO_CALIBRATION: {
  set: CalibrationSet; kge: number; scores: { daily: SkillScores; monthly: SkillScores | null }; ranges: { key: string; low: number; high: number }[];
} = {
  set: {
    parameters: {
      lapseRateCPerKm: -5.80327
    },
    precipitationFactor: 1.49574
  },
  kge: 0.996226,
  scores: {
    daily: {
      count: 171,
      nse: 0.992454,
      kge: 0.996226,
      r: 0.996227,
      alpha: 0.999993,
      beta: 1.00009,
      biasPercent: 0.00861071,
      meanObserved: 5.12064,
      meanSimulated: 5.12108
    },
    monthly: {
      count: 5,
      nse: 0.996521,
      kge: 0.974975,
      r: 0.998536,
      alpha: 0.975018,
      beta: 0.999994,
      biasPercent: -0.000558231,
      meanObserved: 4.8936,
      meanSimulated: 4.89357
    }
  },
  ranges: [
    {
      key: 'lapseRateCPerKm',
      low: -5.88335,
      high: -5.72319
    },
    {
      key: 'precipitationFactor',
      low: 1.34575,
      high: 1.64572
    }
  ]
};
