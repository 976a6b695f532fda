import type { WARMING_LEVELS } from '../schemas/scenarios';

/**
 * Observed global warming up to the station-record era: 2011–2020 was about 1.09 °C above
 * 1850–1900 (IPCC AR6 WG1 SPM A.1.2) [memory]. A station record of that era already carries it,
 * so a global warming level adds only the rest.
 */
export const OBSERVED_WARMING_C = 1.09;

/**
 * Temperature change to apply to the station record for a global warming level (IPCC AR6 levels
 * above 1850–1900). Mountain regions often warm faster than the global mean; the user should
 * edit the starting value (one number or twelve monthly values) for the region.
 */
export function warmingLevelDeltaC(level: (typeof WARMING_LEVELS)[number]): number {
  return Math.round((Number(level) - OBSERVED_WARMING_C) * 100) / 100;
}
