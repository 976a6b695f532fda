/**
 * Diffuse fraction of hourly global radiation on the horizontal from the clearness index
 * kt = G / G0 (G0 extraterrestrial on the horizontal), Erbs, Klein & Duffie 1982 (Sol. Energy
 * 28:293) [read form, as reproduced in Sandia's PV_LIB]:
 *   kt ≤ 0.22:          kd = 1 − 0.09 kt
 *   0.22 < kt ≤ 0.80:   kd = 0.9511 − 0.1604 kt + 4.388 kt² − 16.638 kt³ + 12.336 kt⁴
 *   kt > 0.80:          kd = 0.165
 * Cloud therefore moves beam into diffuse instead of scaling both.
 *
 * @example erbsDiffuseFraction(0.5) // ≈ 0.66
 */
export function erbsDiffuseFraction(clearnessIndex: number): number {
  const kt = clearnessIndex;
  if (kt <= 0.22) return 1 - 0.09 * (kt > 0 ? kt : 0);
  if (kt > 0.8) return 0.165;
  const k2 = kt * kt;
  return 0.9511 - 0.1604 * kt + 4.388 * k2 - 16.638 * k2 * kt + 12.336 * k2 * k2;
}
