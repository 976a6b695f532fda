import type { CalibrationSet } from '../../shared/lab/calibration-set';

/**
 * The demo catchment's saved calibration, as the lab finds it from the demo's synthetic discharge
 * (regenerate with scripts/demo-calibration.ts; seeds/data/demo-calibrate.test.ts checks it).
 */
export const DEMO_CALIBRATION: { set: CalibrationSet; kge: number; ranges: { key: string; low: number; high: number }[] } = {
  set: {
    parameters: {
      lapseRateCPerKm: -5.80327
    },
    precipitationFactor: 1.49574
  },
  kge: 0.996226,
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
