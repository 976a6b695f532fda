import type { ParameterSpec } from '../melt/parameters';
import { OBSERVED_WARMING_C } from '../analysis/warming-presets';
import { refuse, requireInRange } from './errors';

/**
 * A warming path for a transient scenario: global warming rises linearly from the level already
 * in the station record (≈ 1.09 °C above 1850–1900 for 2011–2020, IPCC AR6 WG1 SPM A.1.2
 * [memory]) to a chosen global warming level (IPCC AR6 levels: 1.5, 2, 3, 4 °C above 1850–1900) in
 * a chosen year, and holds it afterwards. The local temperature change applied to the record is
 * the global change beyond the record's level times a regional factor (mountains often warm
 * faster than the global mean), and precipitation changes in proportion to the warming.
 */

export const REGIONAL_WARMING_FACTOR: ParameterSpec = {
  default: 1, min: 0.5, max: 3, unit: '-',
  source: 'local warming per degree of global warming; high mountains often warm faster (elevation-dependent warming, Pepin et al. 2015, Nat. Clim. Change 5:424) [memory]; set it from regional projections',
};

export interface WarmingPathInput {
  fromYear: number;
  toYear: number;
  /** Global warming level to reach, °C above 1850–1900. */
  warmingLevelC: number;
  /** Year the level is reached. */
  targetYear: number;
  /** Year the station record stands for (e.g. its middle year). */
  recordYear: number;
  /** Global warming already in the record, °C above 1850–1900; default 1.09 (2011–2020). */
  recordWarmingC?: number;
  regionalFactor?: number;
  /** Precipitation change at the target level as a fraction (0.05 = +5 %), reached in step with the warming. */
  precipitationChangeAtTarget?: number;
}

export interface WarmingPath {
  years: Int32Array;
  /** Global warming above 1850–1900, °C. */
  globalWarmingC: Float64Array;
  /** Temperature change to apply to the record, K. */
  temperatureDeltaC: Float64Array;
  /** Factor to apply to the record's precipitation. */
  precipitationFactor: Float64Array;
}

/**
 * @throws HydrologyInputError naming the field out of range (years in order, at most 200 of them, a target after the record)
 * @example warmingPath({ fromYear: 2020, toYear: 2070, warmingLevelC: 2, targetYear: 2050, recordYear: 2015 }).temperatureDeltaC[30] // 0.91 (2050: 2 − 1.09)
 */
export function warmingPath(input: WarmingPathInput): WarmingPath {
  const { fromYear, toYear, warmingLevelC, targetYear, recordYear } = input;
  const recordWarmingC = input.recordWarmingC ?? OBSERVED_WARMING_C;
  const regionalFactor = input.regionalFactor ?? REGIONAL_WARMING_FACTOR.default;
  const precipitationChange = input.precipitationChangeAtTarget ?? 0;
  for (const [key, value] of Object.entries({ fromYear, toYear, targetYear, recordYear })) {
    if (!Number.isInteger(value) || value < 1850 || value > 2300) refuse(key, `the year ${value} must be a whole year between 1850 and 2300.`);
  }
  if (toYear < fromYear) refuse('toYear', `the last year (${toYear}) comes before the first (${fromYear}).`);
  if (toYear - fromYear + 1 > 200) refuse('toYear', `a transient run covers at most 200 years; ${fromYear}–${toYear} is ${toYear - fromYear + 1}.`);
  if (targetYear <= recordYear) refuse('targetYear', `the warming level must be reached after the record's year (${recordYear}).`);
  requireInRange(warmingLevelC, 0, 6, 'warmingLevelC', 'The warming level', '°C');
  requireInRange(recordWarmingC, 0, 3, 'recordWarmingC', 'The warming in the record', '°C');
  requireInRange(regionalFactor, REGIONAL_WARMING_FACTOR.min, REGIONAL_WARMING_FACTOR.max, 'regionalFactor', 'The regional warming factor');
  requireInRange(precipitationChange, -0.5, 0.5, 'precipitationChangeAtTarget', 'The precipitation change');
  const n = toYear - fromYear + 1;
  const path: WarmingPath = { years: new Int32Array(n), globalWarmingC: new Float64Array(n), temperatureDeltaC: new Float64Array(n), precipitationFactor: new Float64Array(n) };
  for (let i = 0; i < n; i++) {
    const year = fromYear + i;
    const progress = Math.min(1, Math.max(0, (year - recordYear) / (targetYear - recordYear)));
    path.years[i] = year;
    path.globalWarmingC[i] = recordWarmingC + progress * (warmingLevelC - recordWarmingC);
    path.temperatureDeltaC[i] = regionalFactor * (path.globalWarmingC[i] - recordWarmingC);
    path.precipitationFactor[i] = 1 + progress * precipitationChange;
  }
  return path;
}
