/**
 * Global radiation from the daily temperature range when no radiation or cloud data exist:
 * FAO-56 Eq. 50 (Hargreaves), Rs = kRs √(Tmax − Tmin) Ra, kRs ≈ 0.16 for interior and 0.19 for
 * coastal sites (Allen et al. 1998) [read]. The engine uses it as a clear-sky index, Rs / Rso,
 * capped at 1, with Rso the site's own clear-sky day (ASCE-EWRI 2005), so the estimate never
 * exceeds the clear sky.
 *
 * @param temperatureRangeK daily maximum minus minimum, K (negative is read as 0)
 * @param extraterrestrialDaily Ra, any energy unit per day
 * @param clearSkyDaily Rso in the same unit
 * @param coefficient kRs
 * @example temperatureRangeClearSkyIndex(12, 40, 31, 0.16) // ≈ 0.72
 */
export function temperatureRangeClearSkyIndex(temperatureRangeK: number, extraterrestrialDaily: number, clearSkyDaily: number, coefficient: number): number {
  if (!(clearSkyDaily > 0)) return 1;
  const rs = coefficient * Math.sqrt(temperatureRangeK > 0 ? temperatureRangeK : 0) * extraterrestrialDaily;
  return Math.min(1, rs / clearSkyDaily);
}
