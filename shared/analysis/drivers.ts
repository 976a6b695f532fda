import type { Scenario } from '../melt/schema';

/** Drivers of added melt that attribution separates, each a group of engine scenario fields. */
export const DRIVERS = {
  blackCarbon: { label: 'Black carbon', fields: ['blackCarbonSnowNgG', 'blackCarbonIceNgG'] },
  dust: { label: 'Dust', fields: ['dustSnowUgG', 'dustIceUgG'] },
  debris: { label: 'Debris', fields: ['debrisThicknessChangeM', 'debrisExtentChange'] },
  warming: { label: 'Warming', fields: ['temperatureDeltaC'] },
  precipitation: { label: 'Precipitation change', fields: ['precipitationFactor'] },
} as const satisfies Record<string, { label: string; fields: readonly (keyof Scenario)[] }>;
export type Driver = keyof typeof DRIVERS;
export const DRIVER_NAMES = Object.keys(DRIVERS) as Driver[];

function sameValue(a: number | number[], b: number | number[]): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}

/** The drivers in which the variant differs from the baseline, in DRIVER_NAMES order. */
export function changedDrivers(baseline: Scenario, variant: Scenario): Driver[] {
  return DRIVER_NAMES.filter((d) => DRIVERS[d].fields.some((f) => !sameValue(baseline[f], variant[f])));
}

/**
 * The engine scenario with the drivers whose bits are set in `mask` taken from the variant and
 * the rest from the baseline (bit i ↔ drivers[i]) — one combination of factor separation.
 */
export function combinedScenario(baseline: Scenario, variant: Scenario, drivers: readonly Driver[], mask: number): Scenario {
  const out: Scenario = { ...baseline };
  drivers.forEach((driver, i) => {
    if (!(mask & (1 << i))) return;
    for (const field of DRIVERS[driver].fields) (out as Record<string, unknown>)[field] = variant[field];
  });
  return out;
}

/** Plain name of a factor-separation term: one driver, or an interaction such as "Black carbon × Warming". */
export function termLabel(drivers: readonly Driver[], mask: number): string {
  return drivers.filter((_, i) => mask & (1 << i)).map((d) => DRIVERS[d].label).join(' × ');
}
