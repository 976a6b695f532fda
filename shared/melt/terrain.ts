/**
 * Terrain horizons of a band: the share of the band the sun reaches past the surrounding ridges.
 * A band's horizon (schema: horizonDeg) gives, for each azimuth sector, the horizon elevation at
 * the 10th, 30th, 50th, 70th and 90th percentile of its cells. The sunlit share for a sun at
 * elevation e is the share of cells whose horizon lies below e: the piecewise-linear distribution
 * through those five points, continued with the slope of its first and last pieces down to 0
 * and up to 1 (a flat first or last piece steps at that value). Sector k is centred on k·360/n.
 */

/** Sector of an azimuth (degrees clockwise from north) among n sectors centred on k·360/n. */
export function horizonSector(azimuthDeg: number, sectors: number): number {
  const k = Math.round((((azimuthDeg % 360) + 360) % 360) / (360 / sectors));
  return k === sectors ? 0 : k;
}

const SHARES = [0.1, 0.3, 0.5, 0.7, 0.9];

/**
 * Sunlit share 0 … 1 of a band for sun elevation e (degrees), reading the five percentiles of
 * one sector at `offset` in `horizons`.
 *
 * @example sunlitShare(Float64Array.of(10, 12, 14, 16, 18), 0, 14) // 0.5
 */
export function sunlitShare(horizons: Float64Array, offset: number, elevationDeg: number): number {
  const q0 = horizons[offset];
  const q4 = horizons[offset + 4];
  if (elevationDeg <= q0) {
    const step = horizons[offset + 1] - q0;
    if (step <= 0) return 0;
    const share = 0.1 - ((q0 - elevationDeg) / step) * 0.2;
    return share > 0 ? share : 0;
  }
  if (elevationDeg >= q4) {
    const step = q4 - horizons[offset + 3];
    if (step <= 0) return 1;
    const share = 0.9 + ((elevationDeg - q4) / step) * 0.2;
    return share < 1 ? share : 1;
  }
  for (let i = 1; i < 5; i++) {
    const hi = horizons[offset + i];
    if (elevationDeg <= hi) {
      const lo = horizons[offset + i - 1];
      return hi > lo ? SHARES[i - 1] + ((elevationDeg - lo) / (hi - lo)) * 0.2 : SHARES[i];
    }
  }
  return 1;
}
