import { DEG } from './constants';
import { solarPosition } from './solar-position';
import type { Timeline } from './timeline';

/** The sun for every simulated hour, computed once for the catchment (not per band). */
export interface SunTrack {
  cosZenith: Float64Array;
  /** sin Z cos φsun and sin Z sin φsun: with the band's slope terms they give cos θ without trigonometry. */
  sinZenithCosAzimuth: Float64Array;
  sinZenithSinAzimuth: Float64Array;
  /** Sun azimuth, degrees clockwise from north, and elevation above the horizon, degrees (for terrain horizons). */
  azimuthDeg: Float64Array;
  elevationDeg: Float64Array;
}

/** Trigonometry of one sun position, shared by the engine and anything that checks it. */
export function sunGeometry(zenithDeg: number, azimuthDeg: number): [cosZ: number, sinZcosA: number, sinZsinA: number] {
  const z = zenithDeg * DEG;
  const a = azimuthDeg * DEG;
  const sinZ = Math.sin(z);
  return [Math.cos(z), sinZ * Math.cos(a), sinZ * Math.sin(a)];
}

/**
 * Sun position at the middle of each local standard-time hour (suncalc via solarPosition).
 * The Date passed to suncalc is reused, so only suncalc's own small result objects are created.
 */
export function buildSunTrack(timeline: Timeline, latDeg: number, lonDeg: number): SunTrack {
  const hours = timeline.dayCount * 24;
  const track: SunTrack = {
    cosZenith: new Float64Array(hours),
    sinZenithCosAzimuth: new Float64Array(hours),
    sinZenithSinAzimuth: new Float64Array(hours),
    azimuthDeg: new Float64Array(hours),
    elevationDeg: new Float64Array(hours),
  };
  const instant = new Date(0);
  for (let d = 0; d < timeline.dayCount; d++) {
    for (let k = 0; k < 24; k++) {
      const h = d * 24 + k;
      instant.setTime(timeline.dayStartUtcMs[d] + (k + 0.5) * 3_600_000);
      const { zenithDeg, azimuthDeg } = solarPosition(instant, latDeg, lonDeg);
      const [cosZ, sx, sy] = sunGeometry(zenithDeg, azimuthDeg);
      track.cosZenith[h] = cosZ;
      track.sinZenithCosAzimuth[h] = sx;
      track.sinZenithSinAzimuth[h] = sy;
      track.azimuthDeg[h] = azimuthDeg;
      track.elevationDeg[h] = 90 - zenithDeg;
    }
  }
  return track;
}
