import type { CatchmentFields } from '../../shared/schemas/catchments';
import type { BandRow } from '../../shared/schemas/catchment-bands';
import { DEMO_BACKGROUND } from './demo-truth';

/**
 * The demo catchment: an invented glacier basin in an invented valley. Every number is made up
 * to look like a debris-covered mid-latitude high-mountain glacier system; nothing is measured.
 */
export const DEMO_CATCHMENT: CatchmentFields = {
  name: 'Upper Sarvel glacier catchment',
  description:
    'Invented demo basin at the head of the Dhenar valley: a debris-covered valley glacier (the Sarvel) with clean-ice ' +
    'tributaries above 5000 m. All data are synthetic.',
  latitudeDeg: 33.94,
  longitudeDeg: 79.31,
  timeZone: 'Asia/Kolkata',
  stationName: 'Kolvi camp automatic station',
  stationElevationM: 3420,
  outletDescription: 'Staff gauge and pressure logger on the Sarvel stream, 1.2 km below the glacier snout (2610 m).',
  backgroundBlackCarbonNgG: DEMO_BACKGROUND.blackCarbonSnowNgG,
  backgroundDustUgG: DEMO_BACKGROUND.dustSnowUgG,
};

const LOWEST_M = 2600;
const BAND_HEIGHT_M = 200;
const BAND_COUNT = 21;

/**
 * 21 bands of 200 m from 2600 to 6800 m. Area peaks near 5000 m (a bell-shaped hypsometry);
 * glacier cover starts at the snout (3800 m), is densest around 5200–5600 m and thins on the
 * steep summit walls; debris covers most of the lower tongue and thins upward.
 */
export const DEMO_BANDS: BandRow[] = Array.from({ length: BAND_COUNT }, (_, i) => {
  const lowerM = LOWEST_M + i * BAND_HEIGHT_M;
  const mid = lowerM + BAND_HEIGHT_M / 2;
  const glacierFraction = mid < 3800 ? 0 : mid < 5400 ? 0.15 + (0.7 * (mid - 3800)) / 1600 : 0.85 - (0.35 * (mid - 5400)) / 1400;
  const onTongue = Math.max(0, (5000 - mid) / 1200);
  return {
    lowerM,
    upperM: lowerM + BAND_HEIGHT_M,
    areaKm2: round(1.1 + 7.4 * Math.exp(-(((mid - 5000) / 950) ** 2)), 2),
    slopeDeg: round(14 + (22 * (mid - LOWEST_M)) / 4200 + 3 * Math.sin(i), 1),
    aspectDeg: round((350 + 40 * Math.sin(i / 3) + 360) % 360, 0),
    glacierFraction: round(glacierFraction, 2),
    debrisFraction: glacierFraction === 0 ? 0 : round(Math.min(0.9, 0.9 * onTongue + 0.03), 2),
    debrisThicknessM: glacierFraction === 0 ? 0 : round(0.02 + 0.55 * onTongue ** 1.5, 2),
  };
});

function round(value: number, digits: number): number {
  const f = 10 ** digits;
  return Math.round(value * f) / f;
}
