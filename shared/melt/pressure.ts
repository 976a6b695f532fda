import { SEA_LEVEL_PRESSURE_PA } from './constants';

/**
 * Air pressure of the ICAO standard atmosphere at an elevation.
 * P = 101325 (1 − 0.0065 z / 288.15)^5.25588 Pa (ICAO 1993, troposphere).
 *
 * @param elevationM elevation above sea level, m (valid −500 … 11 000 m)
 * @returns pressure in Pa, e.g. pressureAt(1000) ≈ 89 875
 */
export function pressureAt(elevationM: number): number {
  if (!Number.isFinite(elevationM) || elevationM < -500 || elevationM > 11000) {
    throw new RangeError(`pressureAt: elevation ${elevationM} m is outside −500 … 11 000 m`);
  }
  return SEA_LEVEL_PRESSURE_PA * Math.pow(1 - (0.0065 * elevationM) / 288.15, 5.25588);
}
