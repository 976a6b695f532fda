/**
 * Bare-ice albedo lowered by impurities: a user-set linear rule, not a published
 * parameterisation (docs/science.md, bare ice darkening).
 *   α = max(floor, αclean − sBC · BC/1000 − sdust · dust/100)
 * with BC in ng g⁻¹ and dust in µg g⁻¹. The floor defaults to the lower end of dirty ice, 0.15
 * (Paterson 1994 Table 4.1) [memory].
 *
 * @example iceAlbedo(0.34, 1000, 0, { blackCarbonSlope: 0.05, dustSlope: 0.05, floor: 0.15 }) // 0.29
 */
export interface IceAlbedoRule {
  /** Albedo drop per 1000 ng g⁻¹ black carbon. */
  blackCarbonSlope: number;
  /** Albedo drop per 100 µg g⁻¹ dust. */
  dustSlope: number;
  /** Lowest albedo the rule gives. */
  floor: number;
}

export function iceAlbedo(cleanIceAlbedo: number, blackCarbonNgG: number, dustUgG: number, rule: IceAlbedoRule): number {
  if (!(blackCarbonNgG >= 0) || !(dustUgG >= 0)) throw new RangeError('iceAlbedo: impurity loads must be ≥ 0');
  const lowered = cleanIceAlbedo - (rule.blackCarbonSlope * blackCarbonNgG) / 1000 - (rule.dustSlope * dustUgG) / 100;
  return Math.max(Math.min(rule.floor, cleanIceAlbedo), lowered);
}
