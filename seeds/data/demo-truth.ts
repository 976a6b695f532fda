import type { CalibrationSet } from '../../shared/lab/calibration-set';

/**
 * What the demo's invented world "really" is: the parameters its synthetic discharge and stake
 * readings were generated with (demo-observations.ts). The product never reads these; the lab's
 * calibration has to find them from the observations, and a test checks that it does within the
 * uncertainty it reports. Invented values inside the published ranges of the parameters.
 */
export const DEMO_TRUTH: CalibrationSet = {
  parameters: { lapseRateCPerKm: -5.8 },
  precipitationFactor: 1.45,
};

/** Background impurities in the demo valley's fresh snow (the catchment's stored defaults). */
export const DEMO_BACKGROUND = { blackCarbonSnowNgG: 30, dustSnowUgG: 10 };
