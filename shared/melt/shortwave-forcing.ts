import { beamIndexOf, diffuseIndex, MIN_SIN_ELEVATION, precipitableWaterMm } from './clear-sky';
import { cloudinessFromTransmission, cloudOpticalThickness, cloudTransmission } from './cloud';
import { extraterrestrialNormal } from './shortwave';
import { sunAngleFactor } from './snow-albedo';
import { temperatureRangeClearSkyIndex } from './temperature-range';
import { saturationOverWater } from './vapour';
import type { HourlyForcing } from './hourly-forcing';
import type { Parameters } from './parameters';
import type { ShortwaveSource } from './schema';
import type { SunTrack } from './sun-track';
import type { Timeline } from './timeline';

/**
 * Everything about the sky that all bands share, per simulated hour: the ASCE-EWRI 2005 clear-sky
 * terms at the station (each band adds its own pressure and precipitable-water factor in the hour
 * loop), the cloud index G/Gclear from the chosen source, and what cloud means for longwave and
 * snow albedo.
 *
 * Sources, in the order 'auto' takes them: a measured global-radiation series (daily ratio of
 * measured to the station's clear-sky sum); a cloudiness series (Kasten & Czeplak 1980); the daily
 * temperature range (FAO-56 Eq. 50 with kRs, see temperature-range.ts); or, when asked for, a
 * fixed cloudiness. Longwave uses the cloudiness that the cloud index implies.
 */
export interface ShortwaveForcing {
  source: ShortwaveSource;
  /** I0 (Rm/R)² cos Z, extraterrestrial irradiance on the horizontal (0 with the sun down), W m⁻². */
  topHorizontalWm2: Float64Array;
  /** 1 / cos Z with the sun up (beam on the horizontal → normal), else 0. */
  inverseCosZenith: Float64Array;
  /** −0.00146 / (Kt sin β): times the band's pressure in kPa, the first term of the beam exponent. */
  pressureTerm: Float64Array;
  /** −0.075 (W / sin β)^0.4 at the station: times the band's precipitable-water factor, the second term. */
  vapourTerm: Float64Array;
  /** G / Gclear, 0 … 1. */
  cloudIndex: Float64Array;
  /** Cloudiness 0 … 1 for longwave. */
  cloudiness: Float64Array;
  /** Cloud optical thickness and ln(1 + 1.5 τ), for the snow-albedo cloud term. */
  cloudOpticalThickness: Float64Array;
  cloudLogTerm: Float64Array;
  /** (1 − u)^1.2 of the snow-albedo sun-angle term, u the effective cos Z under this cloud. */
  albedoSunFactor: Float64Array;
}

export function chooseShortwaveSource(requested: ShortwaveSource | 'auto', forcing: HourlyForcing): ShortwaveSource {
  if (requested !== 'auto') return requested;
  if (forcing.globalRadiationWm2) return 'measured';
  if (forcing.cloudiness) return 'cloudiness';
  return 'temperature-range';
}

export function buildShortwaveForcing(
  timeline: Timeline, sun: SunTrack, forcing: HourlyForcing, params: Parameters, stationPressurePa: number, requested: ShortwaveSource | 'auto',
): ShortwaveForcing {
  const source = chooseShortwaveSource(requested, forcing);
  if (source === 'measured' && !forcing.globalRadiationWm2) throw new RangeError('shortwave source "measured" needs forcing.globalRadiationWm2');
  if (source === 'cloudiness' && !forcing.cloudiness) throw new RangeError('shortwave source "cloudiness" needs forcing.cloudiness');
  const hours = timeline.dayCount * 24;
  const make = () => new Float64Array(hours);
  const sw: ShortwaveForcing = {
    source, topHorizontalWm2: make(), inverseCosZenith: make(), pressureTerm: make(), vapourTerm: make(), cloudIndex: make(),
    cloudiness: make(), cloudOpticalThickness: make(), cloudLogTerm: make(), albedoSunFactor: make(),
  };
  const stationKPa = stationPressurePa / 1000;
  const fixedIndex = cloudTransmission(params.defaultCloudiness);
  const cloud = new HourCloud();
  for (let d = 0; d < timeline.dayCount; d++) {
    const top = extraterrestrialNormal(timeline.daysOfYear[d]);
    let topSum = 0;
    let clearSum = 0;
    let measuredSum = 0;
    for (let h = d * 24; h < d * 24 + 24; h++) {
      if (forcing.globalRadiationWm2) measuredSum += forcing.globalRadiationWm2[h];
      const cosZ = sun.cosZenith[h];
      if (cosZ <= 0) continue;
      const s = cosZ > MIN_SIN_ELEVATION ? cosZ : MIN_SIN_ELEVATION;
      const vapourKPa = (forcing.relativeHumidity[h] * saturationOverWater(forcing.temperatureC[h])) / 1000;
      const w = precipitableWaterMm(vapourKPa, stationKPa);
      sw.topHorizontalWm2[h] = top * cosZ;
      sw.inverseCosZenith[h] = 1 / cosZ;
      sw.pressureTerm[h] = -0.00146 / (params.turbidity * s);
      const waterPower = Math.pow(w / s, 0.4);
      sw.vapourTerm[h] = -0.075 * waterPower;
      const kb = beamIndexOf(stationKPa, s, params.turbidity, waterPower);
      topSum += top * cosZ;
      clearSum += (kb + diffuseIndex(kb)) * top * cosZ;
    }
    for (let h = d * 24; h < d * 24 + 24; h++) {
      if (source === 'cloudiness') {
        const n = forcing.cloudiness![h];
        if (n !== cloud.cloudiness) cloud.of(cloudTransmission(n), n);
      } else {
        let index: number;
        if (source === 'measured') index = clearSum > 0 ? Math.min(1, measuredSum / clearSum) : 1;
        else if (source === 'temperature-range') index = temperatureRangeClearSkyIndex(forcing.dailyRangeK[d], topSum, clearSum, params.temperatureRangeRadiationCoefficient);
        else index = fixedIndex;
        if (index !== cloud.index) cloud.of(index, source === 'fixed-cloudiness' ? params.defaultCloudiness : cloudinessFromTransmission(index));
      }
      sw.cloudIndex[h] = cloud.index;
      sw.cloudiness[h] = cloud.cloudiness;
      sw.cloudOpticalThickness[h] = cloud.tau;
      sw.cloudLogTerm[h] = cloud.logTerm;
      sw.albedoSunFactor[h] = sunAngleFactor(sun.cosZenith[h], cloud.tau);
    }
  }
  return sw;
}

/**
 * The cloud of the hour and what follows from it (index, cloudiness, optical thickness and its
 * log term), worked out again only when the cloud changes: daily series give the same cloud to
 * all 24 hours of a day.
 */
class HourCloud {
  index = NaN;
  cloudiness = NaN;
  tau = 0;
  logTerm = 0;

  of(index: number, cloudiness: number): void {
    this.index = index;
    this.cloudiness = cloudiness;
    this.tau = cloudOpticalThickness(index);
    this.logTerm = Math.log(1 + 1.5 * this.tau);
  }
}
