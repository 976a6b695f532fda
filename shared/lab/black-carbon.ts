import { simulate } from '../melt/simulate';
import { PARAMETER_RANGES, type Parameters } from '../melt/parameters';
import { logSpaced, surfacesInput, type BandSite } from './site';

/** Black carbon of the curves, ng g⁻¹: 0 (clean) then log-spaced from 1 to 5000. */
export const BLACK_CARBON_NG_G = [0, ...logSpaced(1, 5000, 16)];

export type ImpuritySurface = 'freshSnow' | 'oldSnow' | 'bareIce';

/** Snow water equivalent no season melts through, so the snow surface stays snow. */
const DEEP_SNOW_MM = 20_000;

/**
 * Grain settings of the two snow surfaces, at the ends of the engine's parameter ranges:
 * fresh fine snow starts at the finest grains and grows as slowly as allowed; old coarse snow
 * starts coarse and grows as fast as allowed. Warren 2013 (JGR 118:779) shows black carbon
 * lowering the albedo of coarse melting snow more than of fine cold snow [read].
 */
const GRAINS: Record<'freshSnow' | 'oldSnow', Partial<Parameters>> = {
  freshSnow: {
    freshGrainRadiusUm: PARAMETER_RANGES.freshGrainRadiusUm.min,
    maxGrainRadiusUm: PARAMETER_RANGES.maxGrainRadiusUm.min,
    wetGrainGrowthMm3PerDay: PARAMETER_RANGES.wetGrainGrowthMm3PerDay.min,
    dryGrainGrowthMm3PerDay: PARAMETER_RANGES.dryGrainGrowthMm3PerDay.min,
  },
  oldSnow: {
    freshGrainRadiusUm: PARAMETER_RANGES.freshGrainRadiusUm.max,
    maxGrainRadiusUm: PARAMETER_RANGES.maxGrainRadiusUm.max,
    wetGrainGrowthMm3PerDay: PARAMETER_RANGES.wetGrainGrowthMm3PerDay.max,
  },
};

export const IMPURITY_LABELS: Record<ImpuritySurface, string> = {
  freshSnow: `Fresh fine snow (grains from ${GRAINS.freshSnow.freshGrainRadiusUm} µm, slowest growth)`,
  oldSnow: `Old coarse snow (grains from ${GRAINS.oldSnow.freshGrainRadiusUm} µm, fastest growth)`,
  bareIce: 'Bare ice',
};

export interface ImpurityCurve {
  surface: ImpuritySurface;
  label: string;
  points: { blackCarbonNgG: number; meltMm: number }[];
}

/** Snow melt of a deep-snow copy of the band and ice melt of a bare-ice copy, at one black-carbon load. */
function meltAt(site: BandSite, grains: Partial<Parameters>, blackCarbonNgG: number): { snowMm: number; iceMm: number } {
  const surfaces = [{ glacierFraction: 1, debrisFraction: 0 }, { glacierFraction: 1, debrisFraction: 0 }];
  const input = surfacesInput({ ...site, parameters: { ...site.parameters, ...grains } }, surfaces, [DEEP_SNOW_MM, 0], {
    scenario: { blackCarbonSnowNgG: blackCarbonNgG, blackCarbonIceNgG: blackCarbonNgG },
  });
  const totals = simulate(input).bandTotals;
  return { snowMm: totals.snowMeltMm[0], iceMm: totals.iceMeltMm[1] };
}

/**
 * Melt over the period against black carbon for fresh fine snow, old coarse snow and bare ice at
 * the band, from the engine's energy balance: snow albedo after Gardner & Sharp 2010 with its
 * grain-size dependence, bare-ice albedo by the engine's user-set impurity rule.
 */
export function impurityCurves(site: BandSite): ImpurityCurve[] {
  const fine = BLACK_CARBON_NG_G.map((bc) => meltAt(site, GRAINS.freshSnow, bc));
  const coarse = BLACK_CARBON_NG_G.map((bc) => meltAt(site, GRAINS.oldSnow, bc).snowMm);
  const curve = (surface: ImpuritySurface, melt: number[]): ImpurityCurve => ({
    surface,
    label: IMPURITY_LABELS[surface],
    points: BLACK_CARBON_NG_G.map((blackCarbonNgG, i) => ({ blackCarbonNgG, meltMm: melt[i] })),
  });
  return [
    curve('freshSnow', fine.map((m) => m.snowMm)),
    curve('oldSnow', coarse),
    curve('bareIce', fine.map((m) => m.iceMm)),
  ];
}
